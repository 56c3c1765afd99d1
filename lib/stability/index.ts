/** Public API of the linear-stability core: steady states, dispersion relation, Turing maps, sensitivities, gradients. */
export { analyseState, type ClassifiedPeak, type ScanOptions, type StateAnalysis } from "./analyse-state";
export {
  CLASS_HOPF,
  CLASS_INVALID,
  CLASS_LEGEND,
  CLASS_NO_STEADY_STATE,
  CLASS_STABLE,
  CLASS_PEAK,
  CLASS_UNSTABLE_K0,
  CLASS_WAVE,
  classLabel,
  classNames,
  classOf,
  isStableAtZero,
  isTuring,
  MAP_CLASSES,
  type InstabilityClass,
  type MapClass,
} from "./classes";
export {
  computeDispersion,
  pickSteadyState,
  type DispersionOptions,
  type DispersionResult,
  type GrowthPeak,
} from "./compute-dispersion";
export type { DomainResult, ModeGrowth } from "./describe-domain";
export {
  describeRepeats,
  enumerateModes,
  MAX_ADMISSIBLE_MODES,
  toModelDomain,
  type AdmissibleMode,
  type DomainSpec,
} from "./domains";
export { eigenvalues, leadingEigenvalue } from "./eigen";
export { resolveScales, type ResolvedScales } from "./scales";
export { findSteadyStates, MAX_STEADY_STATES, type SteadyState, type SteadyStateOptions } from "./steady-states";
export { computeTuringConditions, type TuringCondition, type TwoSpeciesTuringConditions } from "./turing-conditions";
export { computeTuringMap, summariseTuringMap, type TuringMapResult } from "./turing-map";
export {
  DEFAULT_MAP_TIME_LIMIT_MS,
  MAX_MAP_CELLS,
  MAX_MAP_WAVENUMBERS,
  MAX_MAP_WORK,
  planTuringMap,
  type MapAxis,
  type MapPlan,
  type TuringMapOptions,
} from "./map-plan";
export { computeMapRows, type MapRows } from "./map-rows";
export {
  computeElasticities,
  predictWavelengthAfterScaling,
  type Elasticity,
  type ElasticityOptions,
  type ElasticityResult,
  type ScaledWavelength,
} from "./sensitivities";
export {
  computeGradientDispersion,
  type GradientOptions,
  type GradientPoint,
  type GradientShape,
  type GradientResult,
} from "./gradients";
