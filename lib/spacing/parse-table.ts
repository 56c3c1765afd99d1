import { readCellNumber } from "./cell-number";
import { SpacingError } from "./errors";
import {
  cellText,
  columnIndexOfLetter,
  columnLetter,
  describeColumn,
  describeColumns,
  headerNames,
  type Grid,
} from "./grid";
import { readDelimitedText } from "./read-delimited";

/** Length unit of the table's numbers. "px" needs a pixel size. */
export type TableUnit = "um" | "nm" | "mm" | "px";

/** Which header names hold what; give x and y, or position, or spacing. */
export interface ColumnMapping {
  x?: string;
  y?: string;
  position?: string;
  spacing?: string;
  /** @default "um" */
  unit?: TableUnit;
  /** µm/px, required when unit is "px". */
  pixelSizeUm?: number;
}

const TO_UM: Record<Exclude<TableUnit, "px">, number> = { um: 1, nm: 1e-3, mm: 1e3 };

/** A ColumnMapping checked: the columns to read, and µm per table unit. */
export interface ResolvedColumnMapping {
  columns: ("x" | "y" | "position" | "spacing")[];
  scale: number;
}

/** Checks the mapping once, before the file is read; throws SpacingError naming the field. */
export function resolveColumnMapping(mapping: ColumnMapping): ResolvedColumnMapping {
  const columns = (["x", "y", "position", "spacing"] as const).filter((k) => mapping[k] !== undefined);
  if (columns.length === 0)
    throw new SpacingError("Say which columns to read: x and y, or position, or spacing.", "mapping");
  if (columns.includes("x") !== columns.includes("y"))
    throw new SpacingError("2-D centroids need both an x and a y column.", "mapping");
  const unit = mapping.unit ?? "um";
  let scale: number;
  if (unit === "px") {
    if (!(mapping.pixelSizeUm && mapping.pixelSizeUm > 0))
      throw new SpacingError('unit "px" needs pixelSizeUm (µm/px) above 0.', "pixelSizeUm");
    scale = mapping.pixelSizeUm;
  } else if (unit in TO_UM) scale = TO_UM[unit];
  else throw new SpacingError(`unit must be "um", "nm", "mm" or "px" (got ${String(unit)}).`, "unit");
  return { columns, scale };
}

/** True when every non-empty cell of the first row reads as a number: the table has no header. */
function isAllNumbers(grid: Grid): boolean {
  const cells = (grid.rows[0] ?? []).filter((c) => cellText(c).trim() !== "");
  return cells.length > 0 && cells.every((c) => "value" in readCellNumber(c, grid.decimalMark));
}

/** Throws when the grid's first row is numbers, not column names. */
export function requireHeader(grid: Grid): void {
  if (!isAllNumbers(grid)) return;
  const line = grid.lines[0];
  const letters = (grid.rows[0] ?? []).map((_, i) => columnLetter(i)).join(", ");
  throw new SpacingError(
    `Line ${line} must be a header naming the columns, but it holds only numbers (columns ${letters}): add a header line naming them, e.g. "spacing (µm)".`,
    "file",
    line,
  );
}

/**
 * The column a mapping names: its header name (exactly, else ignoring case), or its letter as
 * the sheet shows it ("C") when no header is called that.
 */
export function findColumn(header: string[], name: string, role: string): number {
  const want = name.trim();
  const named = (eq: (h: string) => boolean) => header.flatMap((h, i) => (eq(h) ? [i] : []));
  let found = named((h) => h === want);
  if (found.length === 0) found = named((h) => h.toLowerCase() === want.toLowerCase());
  if (found.length > 1)
    throw new SpacingError(
      `${found.length} columns are named "${want}": ${found.map((i) => describeColumn(header, i)).join(", ")}; give the column letter for ${role} instead.`,
      role,
      1,
      name,
    );
  if (found.length === 1) return found[0];
  const byLetter = columnIndexOfLetter(want);
  if (byLetter !== null && byLetter < header.length) return byLetter;
  throw new SpacingError(
    `Column "${name}" (${role}) is not in the header; the columns are: ${describeColumns(header)}.`,
    role,
    1,
    name,
  );
}

/**
 * Maps the named columns of a grid and converts them to µm. Every cell of a mapped column below
 * the header must be a number; a message names the line as a spreadsheet counts it (header =
 * line 1) and the column by letter and header.
 */
export function extractColumns(grid: Grid, mapping: ColumnMapping): Record<string, Float64Array> {
  const { columns, scale } = resolveColumnMapping(mapping);
  requireHeader(grid);
  const header = headerNames(grid);
  const at: Partial<Record<string, number>> = {};
  for (const key of columns) at[key] = findColumn(header, mapping[key]!, key);
  return readColumnsAt(grid, at, scale);
}

/** The columns at the given indices (0 = A) below the header, times `scale`. */
export function readColumnsAt(
  grid: Grid,
  at: Partial<Record<string, number>>,
  scale: number,
): Record<string, Float64Array> {
  const header = headerNames(grid);
  const out: Record<string, Float64Array> = {};
  for (const [key, c] of Object.entries(at) as [string, number][]) {
    const values = new Float64Array(grid.rows.length - 1);
    for (let r = 1; r < grid.rows.length; r++) {
      const n = readCellNumber(grid.rows[r][c] ?? null, grid.decimalMark);
      if ("reason" in n)
        throw new SpacingError(
          `Line ${grid.lines[r]}, column ${describeColumn(header, c)}: ${n.reason}.`,
          key,
          grid.lines[r],
          header[c],
        );
      values[r - 1] = n.value * scale;
    }
    out[key] = values;
  }
  return out;
}

/**
 * Parses CSV/TSV text (delimiter and decimal mark detected, see read-delimited.ts), maps the
 * named columns and converts them to µm. Blank lines are skipped but counted.
 */
export function parseTable(text: string, mapping: ColumnMapping): Record<string, Float64Array> {
  resolveColumnMapping(mapping); // settings errors before file errors
  return extractColumns(readDelimitedText(text), mapping);
}
