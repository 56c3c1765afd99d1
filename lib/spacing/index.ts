export { readSpacingTable, type SpacingTableReadout } from "./read-spacing-table";
export { parseTable, type ColumnMapping, type TableUnit } from "./parse-table";
export { summarize, type Summary } from "./summarize";
export { spacingsFromPositions, type PositionSpacings } from "./positions-1d";
export { computeNearestNeighbours, type NearestNeighbourResult, type Field } from "./nearest-neighbours";
export { welchTTest, type WelchResult } from "./welch-test";
export { SpacingError, SPACING_ERROR_CODES } from "./errors";
export { collectConditionSpellings, conditionKey, type ConditionSpellings } from "./condition-key";
export {
  readTableGrid,
  readSpacingFromGrid,
  decodeTableText,
  type TableFileReadout,
  type TableFileSettings,
} from "./read-table-file";
export { detectColumns, describeTaken, unitOfHeader, type ColumnRole } from "./detect-columns";
export { columnLetter, type Grid, type GridCell } from "./grid";
export { readDelimitedText } from "./read-delimited";
export { isXlsxEntries, isZip, zipEntries, type ZipEntry } from "./zip-entries";
