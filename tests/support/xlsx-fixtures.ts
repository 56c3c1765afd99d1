/**
 * XLSX workbooks written by exceljs for the table tests (never stored as files): each sheet a
 * list of rows; a cell is a number, text, a Date, a formula with or without its saved value, or
 * an error value.
 */
import ExcelJS from "exceljs";

export type FixtureCell = ExcelJS.CellValue;

/** The bytes of a workbook with the given sheets, in order. */
export async function writeWorkbook(sheets: Record<string, FixtureCell[][]>): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(sheets)) {
    const ws = wb.addWorksheet(name);
    rows.forEach((row, r) =>
      row.forEach((value, c) => {
        if (value !== null && value !== undefined) ws.getCell(r + 1, c + 1).value = value;
      }),
    );
  }
  return new Uint8Array(await wb.xlsx.writeBuffer());
}
