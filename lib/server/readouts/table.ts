/**
 * The table half of a readout job: which columns to read (given, or guessed from the header
 * names) and the spacing statistics of lib/spacing.
 */
import "server-only";
import Papa from "papaparse";
import { readSpacingTable, type TableUnit } from "@/lib/spacing";
import type { TableReadoutSettings } from "@/lib/contracts/readout";
import { AppError } from "../errors";
import type { TableReadoutResult } from "./result";

type Columns = NonNullable<TableReadoutSettings["columns"]>;

const UNIT_PATTERN = /[\s_\-(\[]*(µm|um|micron|microns|micrometres?|micrometers?|nm|mm|px|pixels?)[)\]]?\s*$/i;

function unitOf(name: string): TableUnit | null {
  const m = UNIT_PATTERN.exec(name);
  if (!m) return null;
  const u = m[1].toLowerCase();
  if (u === "nm") return "nm";
  if (u === "mm") return "mm";
  if (u.startsWith("px") || u.startsWith("pixel")) return "px";
  return "um";
}

const base = (name: string) =>
  name
    .replace(UNIT_PATTERN, "")
    .trim()
    .toLowerCase()
    .replace(/[\s_\-.]+/g, "");

/** The header names (first row) of a CSV/TSV text. */
export function readHeader(text: string): string[] {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { preview: 1, skipEmptyLines: "greedy" });
  return (parsed.data[0] ?? []).map((h) => h.trim());
}

/**
 * Guesses the mapping from header names: x/y (also cx, centroid_x, x_um…), else a position
 * column, else a spacing column; the unit from a suffix such as "_um", "(nm)" or "px".
 */
export function guessColumns(header: string[]): { columns: Columns; unit: TableUnit | null } | null {
  const find = (names: string[]) => header.find((h) => names.includes(base(h)));
  const x = find(["x", "cx", "centroidx", "posx", "xcentroid", "xpos", "xposition"]);
  const y = find(["y", "cy", "centroidy", "posy", "ycentroid", "ypos", "yposition"]);
  if (x && y) return { columns: { x, y }, unit: unitOf(x) };
  const position = find(["position", "positions", "pos", "distance", "distancealong", "location"]);
  if (position) return { columns: { position }, unit: unitOf(position) };
  const spacing = find([
    "spacing",
    "spacings",
    "interval",
    "period",
    "nndistance",
    "nearestneighbour",
    "nearestneighbor",
    "nn",
  ]);
  if (spacing) return { columns: { spacing }, unit: unitOf(spacing) };
  return null;
}

export function runTableReadout(
  text: string,
  settings: TableReadoutSettings & { pixelSizeUm: number | null; pixelSizeSource: string | null },
): TableReadoutResult {
  let columns = settings.columns;
  let unit = settings.unit ?? null;
  let guessed = false;
  if (!columns || Object.values(columns).every((v) => v === undefined)) {
    const header = readHeader(text);
    const g = guessColumns(header);
    if (!g) {
      throw new AppError(
        "unprocessable",
        `Could not tell from the header which columns to read (the columns are: ${header.join(", ") || "none"}); start a readout with a column mapping: x and y, or position, or spacing.`,
      );
    }
    columns = g.columns;
    unit ??= g.unit;
    guessed = true;
  }
  const u: TableUnit = unit ?? "um";
  if (u === "px" && !settings.pixelSizeUm) {
    throw new AppError(
      "unprocessable",
      'The table is in pixels (unit "px") but no pixel size is known: give the pixel size in µm/px.',
    );
  }
  const table = readSpacingTable(text, { ...columns, unit: u, pixelSizeUm: settings.pixelSizeUm ?? undefined });
  return {
    type: "table",
    mapping: { ...columns, unit: u, guessed },
    pixelSizeUm: settings.pixelSizeUm,
    pixelSizeSource: settings.pixelSizeSource,
    table,
  };
}
