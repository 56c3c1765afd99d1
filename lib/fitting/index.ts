export { FitError, FIT_ERROR_CODES, type FitErrorCode } from "./errors";
export type { LeastSquaresProblem, LocalSolution, SolverStopReason } from "./types";
export { CONVERGED_REASONS } from "./types";
export type { LeastSquaresOptions } from "./resolve-solver-options";
export type { LibraryStageOptions } from "./library-stage";
export type { PolishOptions } from "./polish-levenberg-marquardt";
export { solveLeastSquares, type LeastSquaresResult, type StartReport } from "./solve-least-squares";
export { analyseFit, type AnalysisOptions, type FitAnalysis } from "./analyse-fit";
export { fitCurve, createCurveProblem, type CurveData, type CurveModel, type CurveFit } from "./fit-curve";
export type { CovarianceReport } from "./covariance";
export { SINGULAR_RATIO_LIMIT } from "./covariance";
export { PROFILE_DELTA_95, type ProfileLikelihood, type ProfileSide } from "./profile-likelihood";
export type { Valley, ValleyPoint } from "./trace-valley";
export type { Identifiability } from "./identifiability";
export { computeAicc, computeBic, computeAkaikeWeights } from "./information-criteria";
export { fitWavelengths } from "./fit-wavelengths";
export { compareFits, type LabelledFit, type RankedFit, type FitComparison } from "./compare-fits";
export { HEX_SPACING_TO_FOURIER } from "./resolve-wavelength-spec";
export { addReplicateSpread, type ConditionSpread } from "./replicate-spread";
export type {
  MeasurementKind,
  WavelengthDatum,
  ParameterSetting,
  FixedParameter,
  FreeParameter,
  PerConditionParameter,
  WavelengthFitOptions,
  WavelengthFitSpec,
  WavelengthPrediction,
  WavelengthPredictor,
} from "./wavelength-spec";
export type {
  WavelengthFitResult,
  WavelengthVerdict,
  FittedParameter,
  FittedDatum,
  IntervalSide,
} from "./wavelength-result";
