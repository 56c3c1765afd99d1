export { simulateReactionDiffusion } from "./simulate";
export type { SimulationOptions, SimulationProgress, StationarityOptions } from "./options";
export type { SimulationResult, Snapshot, BlowUpInfo, SimulationStopReason } from "./result";
export type { ReactionSystem, ReactionParams, FieldArray, CellRange } from "./reaction-system";
export { paramAt } from "./reaction-system";
export { createGrid, cellCentreXUm, cellCentreYUm, type Grid, type GridOptions, type Boundary } from "./grid";
export { SIMULATION_LIMITS } from "./limits";
export { SimulationOptionError, SIMULATION_ERROR_CODES } from "./errors";
export { createCosineBasis, type SpectralBasis } from "./cosine-basis";
export { createPeriodicBasis } from "./periodic-basis";
export { createSpectralBasis } from "./spectral-basis";
export { SCHEME_NAMES, SCHEME_ORDER, type SchemeName } from "./schemes";
export type { InitialState } from "./initial-state";
export { evaluateSpatialParameterField, type SpatialParameterField, type SpatialAxis } from "./spatial-parameters";
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
export { planRunSteadyState, planRun } from "./plan-run";
export {
  estimateSolverSeconds,
  LINEAR_THEORY_TOLERANCE,
  RUN_SNAPSHOT_VALUES_LIMIT,
  RUN_STIFFNESS_SAFETY,
  RUN_WORK_LIMIT,
  SOLVER_CELL_STEPS_PER_S,
  type RunFromFit,
  type RunPlan,
  type RunPlanContext,
  type RunRequest,
  type RunSpec,
  type RunStartFrom,
  type RunStartInput,
  type RunSteadyState,
} from "./run-plan";
