import type { GridCell } from "./grid";
import { DECIMAL_COMMA_NUMBER } from "./read-delimited";

const INTEGER = /^[-+]?\d+([eE][-+]?\d+)?$/;
const POINT_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
/** Digits grouped by a separator, like "1.234,5", "1,234.5", "1 234" or "1'234". */
const GROUPED = /^[-+]?\d{1,3}([.,' \u00a0\u202f]\d{3})+([.,]\d+)?$/;

/** A cell read as a number, or why it is not one (the end of a sentence naming line and column). */
export type CellNumber = { value: number } | { reason: string };

/**
 * Reads one cell as a number. Workbook numbers are taken as they are; text is read with the
 * file's decimal mark. Thousands separators are never guessed: "1.234,5" could be 1234.5 or a
 * typing error, so it is refused with the reason rather than read wrong.
 */
export function readCellNumber(cell: GridCell, decimalMark: "." | ","): CellNumber {
  if (cell === null) return { reason: "the cell is empty" };
  if (typeof cell === "number")
    return Number.isFinite(cell) ? { value: cell } : { reason: `${cell} is not a finite number` };
  if (cell instanceof Date)
    return {
      reason: `the cell holds a date (${cell.toISOString().slice(0, 10)}), not a number; format the column as numbers`,
    };
  if (typeof cell !== "string") return { reason: cell.problem };
  const t = cell.trim();
  if (t === "") return { reason: "the cell is empty" };
  if (INTEGER.test(t)) return { value: Number(t) };
  if (decimalMark === "." && POINT_NUMBER.test(t)) return { value: Number(t) };
  if (decimalMark === "," && DECIMAL_COMMA_NUMBER.test(t)) return { value: Number(t.replace(",", ".")) };
  if (decimalMark === "," && POINT_NUMBER.test(t))
    return {
      reason: `"${t}" has a point, but the numbers of this file use decimal commas; a point could be a decimal point or a thousands separator, so it is not guessed: write it with a decimal comma`,
    };
  if (GROUPED.test(t) && /[.,].*[.,' \u00a0\u202f]|[' \u00a0\u202f]/.test(t))
    return {
      reason: `"${t}" looks like a number with a thousands separator; thousands separators are not guessed: remove them and keep one decimal mark`,
    };
  if (decimalMark === "." && DECIMAL_COMMA_NUMBER.test(t))
    return {
      reason: `"${t}" has a decimal comma where decimal points are expected: save a comma-separated file with ";" as the separator, or format a workbook cell as a number`,
    };
  return { reason: `"${t}" is not a number` };
}
