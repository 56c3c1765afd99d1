import type { FieldStats } from "./field-stats";
import type { Grid } from "./grid";
import type { SchemeName } from "./schemes";
import type { TimeStepRule } from "./step-size";

/** Why a run stopped. */
export type SimulationStopReason = "end-time" | "stationary" | "cancelled" | "blow-up";

/** A copy of the fields taken at the first step at or after `requestedTimeS`. */
export interface Snapshot {
  requestedTimeS: number;
  timeS: number;
  step: number;
  fields: Float64Array[];
}

/** Where and why a run blew up; the result's fields are the last good state. */
export interface BlowUpInfo {
  /** Step whose result was bad (1-based) and its time (s). */
  step: number;
  timeS: number;
  /** Time of the last good state (s), returned as the final fields. */
  lastGoodTimeS: number;
  /** Largest |c| of the bad state (NaN when a value was NaN). */
  maxAbs: number;
}

/** Summary of the adaptive steps, kept in the result and a run's provenance. */
export interface AdaptiveStepSummary {
  /** Relative tolerance rtol of the local error. */
  tolerance: number;
  /** The step-size rule in words, with its sources. */
  rule: string;
  acceptedSteps: number;
  rejectedSteps: number;
  firstStepS: number;
  smallestStepS: number;
  largestStepS: number;
  lastStepS: number;
}

/** Plain result of {@link simulateReactionDiffusion}. */
export interface SimulationResult {
  grid: Grid;
  speciesNames: string[];
  scheme: SchemeName;
  /** Final fields, row-major (the last good state after a blow-up). */
  fields: Float64Array[];
  /** Simulated time of `fields` (s). */
  timeS: number;
  /** Steps taken to reach `fields`. */
  steps: number;
  /** The fixed-step rule; with adaptive steps, the rule that chose the first step. */
  timeStep: TimeStepRule;
  /** Adaptive steps: tolerance, rule, accepted and rejected steps, step sizes; null with fixed steps. */
  adaptive: AdaptiveStepSummary | null;
  stopReason: SimulationStopReason;
  /** One sentence saying why the run stopped. */
  message: string;
  /** True when the last completed stationarity window met the criterion. */
  stationary: boolean;
  /** Relative L2 change rate of the last completed window (1/s), null before the first. */
  lastChangeRatePerS: number | null;
  stationarityTolerancePerS: number;
  stationarityWindowS: number;
  blowUp: BlowUpInfo | null;
  snapshots: Snapshot[];
  /** Min / max / mean per species of `fields`. */
  stats: FieldStats[];
  /** Seed of the initial noise (null when fields were given). */
  seed: string | null;
}
