/**
 * XLSX workbooks read into a grid with exceljs (a maintained reader of Office Open XML): the
 * first sheet, or the one named in the settings. Formulas are read by the value the spreadsheet
 * program saved with them; date cells stay dates, so a numeric column holding one is refused.
 */
import ExcelJS from "exceljs";
import { SpacingError } from "./errors";
import type { Grid, GridCell } from "./grid";
import { zipEntries } from "./zip-entries";

/** Largest unpacked workbook read (design choice: a table of a million rows is ~100 MiB of XML). */
export const MAX_XLSX_UNPACKED_BYTES = 512 * 1024 * 1024;

type CellValue = ExcelJS.CellValue;

/** One exceljs cell value as a grid cell. */
function toGridCell(v: CellValue): GridCell {
  if (v === null || v === undefined) return null;
  if (typeof v === "number" || typeof v === "string" || v instanceof Date) return v;
  if (typeof v === "boolean") return v ? "TRUE" : "FALSE";
  if ("error" in v) return { problem: `the cell holds the error ${v.error}` };
  if ("richText" in v) return v.richText.map((t) => t.text).join("");
  if ("formula" in v || "sharedFormula" in v) {
    const result = (v as { result?: unknown }).result;
    if (result === undefined || result === null) {
      const f = "formula" in v ? v.formula : v.sharedFormula;
      return {
        problem: `the formula "=${f}" has no saved value (the file was written by a program that does not compute formulas); open and save it in a spreadsheet program`,
      };
    }
    return toGridCell(result as CellValue);
  }
  if ("text" in v) return typeof v.text === "string" ? v.text : toGridCell(v.text as CellValue);
  return { problem: "the cell holds neither a number nor text" };
}

/** Reads a sheet of an XLSX workbook (the first one unless `sheet` names another). */
export async function readXlsx(bytes: Uint8Array, sheet?: string): Promise<Grid> {
  const entries = zipEntries(bytes);
  const unpacked = entries.reduce((sum, e) => sum + e.uncompressedBytes, 0);
  if (unpacked > MAX_XLSX_UNPACKED_BYTES)
    throw new SpacingError(
      `The workbook unpacks to ${Math.round(unpacked / 1048576)} MiB, above the limit of ${MAX_XLSX_UNPACKED_BYTES / 1048576} MiB; save the sheet as CSV and upload that.`,
      "file",
    );
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength) as never);
  } catch (err) {
    throw new SpacingError(
      `The workbook cannot be read (${err instanceof Error ? err.message : String(err)}); open and save it again in a spreadsheet program.`,
      "file",
    );
  }
  const names = workbook.worksheets.map((w) => w.name);
  const ws = sheet === undefined ? workbook.worksheets[0] : workbook.worksheets.find((w) => w.name === sheet.trim());
  if (!ws)
    throw new SpacingError(
      sheet === undefined
        ? "The workbook has no sheet."
        : `The workbook has no sheet named "${sheet}"; its sheets are: ${names.map((n) => `"${n}"`).join(", ")}.`,
      "sheet",
    );
  const rows: GridCell[][] = [];
  const lines: number[] = [];
  ws.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: GridCell[] = [];
    row.eachCell({ includeEmpty: false }, (cell, col) => {
      cells[col - 1] = toGridCell(cell.value);
    });
    for (let i = 0; i < cells.length; i++) cells[i] ??= null;
    if (cells.every((c) => c === null || (typeof c === "string" && c.trim() === ""))) return;
    rows.push(cells);
    lines.push(rowNumber);
  });
  if (rows.length === 0) throw new SpacingError(`The sheet "${ws.name}" is empty.`, "file");
  return { rows, lines, decimalMark: ".", source: { kind: "xlsx", sheet: ws.name } };
}
