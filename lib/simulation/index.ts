export { simulateReactionDiffusion } from "./simulate";
export type { SimulationOptions, SimulationProgress, StationarityOptions } from "./options";
export type { SimulationResult, Snapshot, BlowUpInfo, StopReason } from "./result";
export type { ReactionSystem, ReactionParams, FieldArray, CellRange } from "./reaction-system";
export { paramAt } from "./reaction-system";
export { createGrid, cellCentreXUm, cellCentreYUm, type Grid, type GridOptions, type Boundary } from "./grid";
export { SIMULATION_LIMITS } from "./limits";
export { SimulationOptionError, SIMULATION_ERROR_CODES } from "./errors";
export { DctPlan } from "./dct";
export { createCosineBasis, type SpectralBasis } from "./cosine-basis";
export { createPeriodicBasis } from "./periodic-basis";
export { createSpectralBasis } from "./spectral-basis";
export { RealFftPlan } from "./real-fft";
export { SCHEME_NAMES, SCHEME_ORDER, type SchemeName } from "./schemes";
export type { InitialState } from "./initial-state";
export { resolveParameterProfile, type ParameterProfile, type ProfileAxis } from "./spatial-parameters";
export {
  computeReactionJacobian,
  computeSpectralRadius,
  computeReactionStiffness,
  chooseTimeStep,
  type TimeStepRule,
} from "./step-size";
export { computeFieldStats, computeRelativeChangeRate, type FieldStats } from "./field-stats";
export { createSerialExecutor, type DiffusionExecutor, type DiffusionLayout } from "./executor";
export { runDiffusionStage, StageMode, type SpeciesBuffers } from "./diffusion-stage";
export { schnakenbergReaction, schnakenbergSteadyState, createLinearDecayReaction } from "./reference-kinetics";
export { phi1, phi2 } from "./phi-functions";
export { createReactionSystemFromKinetics, readKineticsDiffusion, readKineticsSteadyState } from "./from-kinetics";
export {
  decomposeDiffusion,
  isDiagonalMatrix,
  createModeReactionSystem,
  MAX_MODE_CONDITION,
  type DiffusionModes,
} from "./cross-diffusion";
