import Papa from "papaparse";
import { SpacingError } from "./errors";
import type { Grid } from "./grid";

/** A number written with a decimal comma, as spreadsheet programs in many locales save it: "12,5". */
export const DECIMAL_COMMA_NUMBER = /^[-+]?(\d+,\d*|,\d+)([eE][-+]?\d+)?$/;

/** A stand-in delimiter for one-column files, so a decimal comma is not taken for a separator. */
const NO_DELIMITER = "\u001f";

/**
 * The delimiter, judged from the header line (its first non-blank line): a tab, else a
 * semicolon, else a comma; none (one column) when the header has none of them. The header is
 * the one line whose cells are names, not numbers, so a decimal comma cannot mislead it.
 */
function detectDelimiter(text: string): string {
  const first = text.split(/\r\n|\n|\r/).find((l) => l.trim() !== "") ?? "";
  const unquoted = first.replace(/"[^"]*"/g, "");
  for (const d of ["\t", ";", ","]) if (unquoted.includes(d)) return d;
  return NO_DELIMITER;
}

/**
 * The decimal mark of the data cells. A comma-separated file can only use points. A semicolon-
 * or tab-separated file (or a one-column file) uses decimal commas when any data cell is written
 * like "12,5"; cells with a point are then refused by name rather than guessed (see cell-number.ts).
 */
function detectDecimalMark(rows: string[][], delimiter: string): "." | "," {
  if (delimiter === ",") return ".";
  for (let r = 1; r < rows.length; r++) for (const c of rows[r]) if (DECIMAL_COMMA_NUMBER.test(c.trim())) return ",";
  return ".";
}

/**
 * A row with more filled cells than the header has columns was split where it should not have
 * been (a thousands separator in a comma-separated file, or text with the delimiter unquoted):
 * refused rather than read shifted.
 */
function refuseLongRows(rows: string[][], lines: number[], delimiter: string): void {
  const width = rows[0]?.length ?? 0;
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r];
    if (row.length <= width || row.slice(width).every((c) => c.trim() === "")) continue;
    const name = delimiter === "," ? "comma" : delimiter === ";" ? "semicolon" : "tab";
    throw new SpacingError(
      `Line ${lines[r]} has ${row.length} cells, but the header names ${width} columns: a ${name} inside a number or a text without quotes? (the line reads: ${row.join(delimiter)})`,
      "file",
      lines[r],
    );
  }
}

/**
 * Reads CSV/TSV text (UTF-8, BOM allowed) into a grid. Lines are counted as a spreadsheet counts
 * its rows: a quoted cell spanning several lines is one row; blank lines count but are not kept.
 */
export function readDelimitedText(text: string): Grid {
  const body = text.replace(/^\uFEFF/, "");
  if (body.trim() === "") throw new SpacingError("The file is empty.", "file");
  const delimiter = detectDelimiter(body);
  const parsed = Papa.parse<string[]>(body, { delimiter, skipEmptyLines: false });
  const rows: string[][] = [];
  const lines: number[] = [];
  parsed.data.forEach((record, i) => {
    if (record.every((c) => c.trim() === "")) return;
    rows.push(record);
    lines.push(i + 1);
  });
  refuseLongRows(rows, lines, delimiter);
  return {
    rows,
    lines,
    decimalMark: detectDecimalMark(rows, delimiter),
    source: { kind: "text", delimiter: delimiter === NO_DELIMITER ? "" : delimiter },
  };
}
