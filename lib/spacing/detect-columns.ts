/**
 * Which columns of a table to read, judged from its header names, and the unit the header
 * states. Names and units as people write them ("X (µm)", "spacing [px]", "Abstand_um",
 * "distance (nm)"), in English and a few common lab languages. A guess is taken only when it is
 * unambiguous; otherwise the user is asked to choose, with every column named as the sheet shows it.
 */
import { SpacingError } from "./errors";
import { describeColumn, describeColumns } from "./grid";
import type { TableUnit } from "./parse-table";

export type ColumnRole = "x" | "y" | "position" | "spacing";

/** A unit written at the end of a header: "(µm)", "[px]", "_um", " in nm", "/µm". */
const UNIT_SUFFIX =
  /(?:\s*[([]\s*|[\s_\-/]+(?:in\s+)?)(µm|μm|um|microns?|micrometres?|micrometers?|mikrometer|nm|nanomet(?:re|er)s?|mm|millimet(?:re|er)s?|px|pixels?|pixel)\s*[)\]]?\s*$/i;

/** The unit a header names, or null. */
export function unitOfHeader(name: string): TableUnit | null {
  const m = UNIT_SUFFIX.exec(name);
  if (!m) return null;
  const u = m[1].toLowerCase();
  if (u === "nm" || u.startsWith("nano")) return "nm";
  if (u === "mm" || u.startsWith("milli")) return "mm";
  if (u.startsWith("px") || u.startsWith("pixel")) return "px";
  return "um";
}

/** A header without its unit, lower case, accents and separators removed: "Abstände (µm)" → "abstande". */
function baseName(name: string): string {
  return name
    .replace(UNIT_SUFFIX, "")
    .normalize("NFD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "");
}

// ImageJ's Results table writes X, Y (centroid) and XM, YM (centre of mass); both count as x / y.
const X_NAMES = ["x", "cx", "xc", "xm", "centroidx", "centerx", "centrex", "posx", "positionx", "xpos", "xposition"];
const ROLE_NAMES: Record<ColumnRole, string[]> = {
  x: [...X_NAMES, "xcoord", "xcoordinate", "xcentroid", "xcenter", "xcentre"],
  y: [...X_NAMES.map((n) => n.replace("x", "y")), "ycoord", "ycoordinate", "ycentroid", "ycenter", "ycentre"],
  // de: Position, Lage; fr/es/it/nl: position, posición, posizione, positie; "distance along" a line
  position: [
    "position",
    "positions",
    "pos",
    "distance",
    "distancealong",
    "location",
    "lage",
    "posicion",
    "posizione",
    "positie",
  ],
  // de: Abstand, Abstände; fr: espacement, écart; es: espaciado; it: spaziatura, distanza; nl: afstand
  spacing: [
    ...["spacing", "spacings", "interval", "period", "nndistance", "nearestneighbour", "nearestneighbor", "nn", "nnd"],
    ...["nearestneighbourdistance", "nearestneighbordistance", "abstand", "abstande", "espacement", "ecart"],
    ...["espaciado", "espaciamiento", "spaziatura", "distanza", "afstand"],
  ],
};

export interface DetectedColumns {
  /** Header name of each column taken. */
  columns: Partial<Record<ColumnRole, string>>;
  /** Column index (0 = A) of each column taken. */
  indices: Partial<Record<ColumnRole, number>>;
  /** The unit the taken columns' headers state, or null when they state none. */
  unit: TableUnit | null;
}

function ask(header: string[], why: string): never {
  throw new SpacingError(
    `${why} Choose the columns in the form (x and y, or position, or spacing); the columns are: ${describeColumns(header)}.`,
    "columns",
    1,
  );
}

/**
 * The columns to read: x and y (2-D centroids), else one position column (1-D; a lone x or y
 * column counts as one when no column is named position or spacing), else one spacing column.
 * Two candidates for one role, or none at all, refuse with the list of columns; so do x and y
 * headers that state different units.
 */
export function detectColumns(header: string[]): DetectedColumns {
  const bases = header.map(baseName);
  const candidates = (role: ColumnRole) =>
    bases.flatMap((b, i) => (header[i] !== "" && ROLE_NAMES[role].includes(b) ? [i] : []));
  const twoFor: (role: string, found: number[]) => never = (role, found) =>
    ask(
      header,
      `The header has ${found.length} columns that could be ${role}: ${found.map((i) => describeColumn(header, i)).join(", ")}.`,
    );
  const xs = candidates("x"),
    ys = candidates("y");
  if (xs.length > 1) twoFor("x", xs);
  if (ys.length > 1) twoFor("y", ys);
  let taken: Partial<Record<ColumnRole, number>>;
  if (xs.length === 1 && ys.length === 1) taken = { x: xs[0], y: ys[0] };
  else {
    const spacings = candidates("spacing");
    const named = candidates("position");
    // a lone x or y column is read as 1-D positions only when no column is named position or spacing
    const positions = named.length > 0 || spacings.length > 0 ? named : [...xs, ...ys];
    if (positions.length > 1) twoFor("the position", positions);
    if (positions.length === 1) taken = { position: positions[0] };
    else if (spacings.length > 1) twoFor("the spacing", spacings);
    else if (spacings.length === 1) taken = { spacing: spacings[0] };
    else ask(header, "Could not tell from the header which columns to read.");
  }
  const units = new Set(Object.values(taken).map((i) => unitOfHeader(header[i])));
  units.delete(null);
  if (units.size > 1) ask(header, `The headers of the columns taken state different units (${[...units].join(", ")}).`);
  const columns: Partial<Record<ColumnRole, string>> = {};
  for (const [role, i] of Object.entries(taken) as [ColumnRole, number][]) columns[role] = header[i];
  return { columns, indices: taken, unit: units.size === 1 ? [...units][0] : null };
}

/** The columns taken, in words: `x = "X (µm)" (column A), y = "Y (µm)" (column B)`. */
export function describeTaken(header: string[], indices: Partial<Record<ColumnRole, number>>): string {
  return (["x", "y", "position", "spacing"] as const)
    .filter((r) => indices[r] !== undefined)
    .map((r) => `${r} = ${describeColumn(header, indices[r]!)}`)
    .join(", ");
}
