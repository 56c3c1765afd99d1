/**
 * The table half of a readout job: the bytes read as an XLSX sheet or delimited text, the
 * columns given or detected from the header (lib/spacing/detect-columns.ts), and the spacing
 * statistics of lib/spacing. Errors are SpacingErrors (422) whose messages name line and column.
 */
import "server-only";
import { readSpacingFromGrid, readTableGrid } from "@/lib/spacing";
import type { TableReadoutSettings } from "@/lib/contracts/readout";
import { AppError } from "../errors";
import type { TableReadoutResult } from "./result";

export async function runTableReadout(
  bytes: Uint8Array,
  settings: TableReadoutSettings & { pixelSizeUm: number | null; pixelSizeSource: string | null },
): Promise<TableReadoutResult> {
  const grid = await readTableGrid(bytes, settings.sheet ?? undefined);
  const read = readSpacingFromGrid(grid, {
    columns: settings.columns,
    unit: settings.unit,
    pixelSizeUm: settings.pixelSizeUm ?? undefined,
  });
  if (read.mapping.unit === "px" && !settings.pixelSizeUm)
    throw new AppError(
      "unprocessable",
      'The table is in pixels (unit "px") but no pixel size is known: give the pixel size in µm/px.',
    );
  return {
    type: "table",
    mapping: read.mapping,
    columnsTaken: read.columnsTaken,
    source: read.source.kind === "xlsx" ? { kind: "xlsx", sheet: read.source.sheet } : { kind: "text" },
    decimalMark: read.decimalMark,
    pixelSizeUm: settings.pixelSizeUm,
    pixelSizeSource: settings.pixelSizeSource,
    table: read.table,
  };
}
