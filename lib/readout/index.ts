export { readWavelength } from "./read-wavelength";
export type { WavelengthReadout, UncertaintyMethod } from "./result";
export {
  resolveReadoutOptions,
  MAX_READOUT_PIXELS,
  DEFAULT_SIGNIFICANCE_THRESHOLD,
  type ReadoutOptions,
  type ResolvedReadoutOptions,
} from "./options";
export { ReadoutError, READOUT_ERROR_CODES, MESSAGES as READOUT_MESSAGES, type ReadoutErrorCode } from "./errors";
export type { Roi, RectRoi, PolygonRoi } from "./roi";
export type { PatternSymmetry } from "./angular";
export { SYMMETRY_THRESHOLDS } from "./angular";
export type { FlattenMethod } from "./flatten";
export type { WindowKind } from "./window";
export { mapLocalWavelength, type LocalWavelengthMap, type LocalWavelengthOptions } from "./local-wavelength";
export { renderFftMagnitude, renderPreview } from "./render-images";
export { DEFAULT_MAX_ANALYSIS_SIDE_PX } from "./options";
