/**
 * A spacing table from the bytes of an upload: an XLSX workbook (judged by its content) or
 * delimited text; the columns as the settings name them, or detected from the header; the
 * readout of lib/spacing, with the columns taken said in words.
 */
import { detectColumns, describeTaken, unitOfHeader, type ColumnRole } from "./detect-columns";
import { SpacingError } from "./errors";
import { headerNames, type Grid } from "./grid";
import { findColumn, readColumnsAt, requireHeader, resolveColumnMapping, type TableUnit } from "./parse-table";
import { readDelimitedText } from "./read-delimited";
import { summarizeColumns, type SpacingTableReadout } from "./read-spacing-table";
import { readXlsx } from "./read-xlsx";
import { isXlsxEntries, isZip, zipEntries } from "./zip-entries";

export interface TableFileSettings {
  /** Header names (or column letters) to read; none given: detected from the header. */
  columns?: Partial<Record<ColumnRole, string>>;
  /** Unit of the numbers; else the one the header states; else µm. */
  unit?: TableUnit;
  /** µm/px, needed when the unit is px. */
  pixelSizeUm?: number;
  /** Sheet of a workbook; the first one when not given. */
  sheet?: string;
}

export interface TableFileReadout {
  table: SpacingTableReadout;
  /** The header names read per role, the unit, and whether they were detected from the header. */
  mapping: Partial<Record<ColumnRole, string>> & { unit: TableUnit; guessed: boolean };
  /** The columns taken in words, as the sheet shows them: `x = A ("X (µm)"), y = B ("Y (µm)")`. */
  columnsTaken: string;
  source: Grid["source"];
  decimalMark: Grid["decimalMark"];
}

/** UTF-8 text, else Windows-1252 (what spreadsheet programs in Western European locales save as "CSV"). */
export function decodeTableText(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder("windows-1252").decode(bytes);
  }
}

/** Reads the bytes into a grid: an XLSX workbook's sheet, or delimited text. */
export async function readTableGrid(bytes: Uint8Array, sheet?: string): Promise<Grid> {
  if (isZip(bytes)) {
    if (!isXlsxEntries(zipEntries(bytes)))
      throw new SpacingError("The file is a ZIP archive but not an XLSX workbook.", "file");
    return readXlsx(bytes, sheet);
  }
  if (sheet !== undefined && sheet.trim() !== "")
    throw new SpacingError(`sheet: only a workbook has sheets; this file is a text table (CSV/TSV).`, "sheet");
  return readDelimitedText(decodeTableText(bytes));
}

/** The readout of a grid with the given settings (columns detected when none are named). */
export function readSpacingFromGrid(grid: Grid, settings: TableFileSettings): TableFileReadout {
  requireHeader(grid);
  const header = headerNames(grid);
  const given = Object.entries(settings.columns ?? {}).filter(([, v]) => v !== undefined && v.trim() !== "");
  let indices: Partial<Record<ColumnRole, number>>;
  let headerUnit: TableUnit | null;
  if (given.length === 0) {
    const d = detectColumns(header);
    indices = d.indices;
    headerUnit = d.unit;
  } else {
    indices = Object.fromEntries(given.map(([role, name]) => [role, findColumn(header, name!, role)]));
    const units = new Set(Object.values(indices).map((i) => unitOfHeader(header[i])));
    headerUnit = units.size === 1 ? [...units][0] : null;
  }
  const unit = settings.unit ?? headerUnit ?? "um";
  const columns: Partial<Record<ColumnRole, string>> = {};
  for (const [role, i] of Object.entries(indices) as [ColumnRole, number][]) columns[role] = header[i];
  // Read by index, so a duplicated or empty header name still reads the column chosen.
  const { scale } = resolveColumnMapping({ ...columns, unit, pixelSizeUm: settings.pixelSizeUm });
  const table = summarizeColumns(readColumnsAt(grid, indices, scale));
  return {
    table,
    mapping: { ...columns, unit, guessed: given.length === 0 },
    columnsTaken: describeTaken(header, indices),
    source: grid.source,
    decimalMark: grid.decimalMark,
  };
}
