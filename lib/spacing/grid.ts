/**
 * A table as a spreadsheet shows it: rows of cells, each row with the line number a spreadsheet
 * program gives it (header = line 1 when the file starts with it), columns named by letter.
 * Delimited text and XLSX workbooks are both read into this shape, so column detection, number
 * parsing and every message are the same for both.
 */

/** A cell that cannot be a number whatever the settings; `problem` says why in the user's words. */
export interface CellProblem {
  problem: string;
}

/** Text from a delimited file or a text cell; a number, date or problem from a workbook. */
export type GridCell = string | number | Date | null | CellProblem;

export interface Grid {
  /** Non-blank rows, the header first. Cells keep their column position (index 0 = column A). */
  rows: GridCell[][];
  /** The spreadsheet line of each row (1-based; blank lines are counted but not kept). */
  lines: number[];
  /** Decimal mark of text cells: "," for semicolon- or tab-separated files with decimal commas. */
  decimalMark: "." | ",";
  /** What the file was: "," / ";" / "\t" separated text, or an XLSX workbook (then `sheet`). */
  source: { kind: "text"; delimiter: string } | { kind: "xlsx"; sheet: string };
}

/** Column letter as a spreadsheet names it: 0 → A, 25 → Z, 26 → AA. */
export function columnLetter(index: number): string {
  let s = "";
  for (let n = index + 1; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}

/** Column index of a letter name ("A" → 0, "AB" → 27), or null when it is not one (at most 3 letters). */
export function columnIndexOfLetter(name: string): number | null {
  if (!/^[A-Za-z]{1,3}$/.test(name)) return null;
  let n = 0;
  for (const ch of name.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

/** The header names of a grid, trimmed; "" where the header cell is empty. */
export function headerNames(grid: Grid): string[] {
  const width = grid.rows.reduce((w, r) => Math.max(w, r.length), 0);
  const head = grid.rows[0] ?? [];
  return Array.from({ length: width }, (_, i) => cellText(head[i] ?? null).trim());
}

/** A column as the sheet shows it: `C ("spacing (µm)")`, or `C (no header)`. */
export function describeColumn(header: string[], index: number): string {
  const name = header[index] ?? "";
  return `${columnLetter(index)} (${name === "" ? "no header" : `"${name}"`})`;
}

/** Every column of the header, described: `A ("x"), B ("y")`. */
export function describeColumns(header: string[]): string {
  return header.length === 0 ? "none" : header.map((_, i) => describeColumn(header, i)).join(", ");
}

/** A cell as text, for headers and messages. */
export function cellText(cell: GridCell): string {
  if (cell === null) return "";
  if (typeof cell === "string") return cell;
  if (typeof cell === "number") return String(cell);
  if (cell instanceof Date) return cell.toISOString().slice(0, 10);
  return cell.problem;
}
