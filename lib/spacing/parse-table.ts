import Papa from "papaparse";
import { SpacingError } from "./errors";

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

/**
 * Parses CSV/TSV text (delimiter detected by papaparse), maps the named columns and converts them
 * to µm. Blank lines are skipped; every other cell of a mapped column must be a number.
 * Row numbers in messages count the header as row 1, like a spreadsheet.
 */
export function parseTable(text: string, mapping: ColumnMapping): Record<string, Float64Array> {
  const { columns, scale } = resolveColumnMapping(mapping);
  if (text.replace(/^\uFEFF/, "").trim() === "") throw new SpacingError("The file is empty.", "file");
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: "greedy" });
  const rows = parsed.data;
  const header = rows[0].map((h) => h.trim());
  if (header.every((h) => h !== "" && Number.isFinite(Number(h)))) {
    throw new SpacingError("Row 1 must be a header naming the columns, but it holds only numbers.", "file", 1);
  }
  const out: Record<string, Float64Array> = {};
  for (const key of columns) {
    const name = mapping[key]!;
    const c = header.indexOf(name.trim());
    if (c < 0)
      throw new SpacingError(
        `Column "${name}" (${key}) is not in the header; the columns are: ${header.join(", ")}.`,
        key,
        1,
        name,
      );
    const values = new Float64Array(rows.length - 1);
    for (let r = 1; r < rows.length; r++) {
      const cell = (rows[r][c] ?? "").trim();
      const v = cell === "" ? Number.NaN : Number(cell);
      if (!Number.isFinite(v)) {
        throw new SpacingError(
          `Row ${r + 1}, column "${name}": ${cell === "" ? "the cell is empty" : `"${cell}" is not a number`}.`,
          key,
          r + 1,
          name,
        );
      }
      values[r - 1] = v * scale;
    }
    out[key] = values;
  }
  return out;
}
