/**
 * Shapes of a verification run's plan: the spec the `simulate` command runs (RUN.json) and the
 * plan shown before the job, plus the limits that decide whether a run may start. Types and
 * constants only; planRunSteadyState / planRun (plan-run.ts) make them.
 */
import type { KineticsSource } from "../kinetics/resolve-kinetics";
import type { CompiledKinetics, KineticsUnits } from "../kinetics/types";
import type { DispersionResult, GradientShape } from "../stability";
import type { Grid, GridOptions } from "./grid";
import type { SpatialParameterField } from "./spatial-parameters";

/**
 * Measured solver speed in cell-species-steps per second by thread count: 256², 2 species, ETD2,
 * medians of 108 steps/s on one thread and 195 with a worker thread (lib/simulation/README.md, Speed).
 */
export const SOLVER_CELL_STEPS_PER_S: Readonly<Record<1 | 2, number>> = {
  1: 256 * 256 * 2 * 108,
  2: 256 * 256 * 2 * 195,
};
/**
 * Most cell-species-steps of one run: 256² cells × 2 species × 20 000 steps, about 100 s with two
 * threads (185 s with one) — a design choice so one run cannot hold the job queue for long.
 */
export const RUN_WORK_LIMIT = 256 * 256 * 2 * 20_000;
/** Most field values kept in snapshots (8 bytes each in memory: 128 MiB). */
export const RUN_SNAPSHOT_VALUES_LIMIT = 2 ** 24;
/** Fraction by which the simulated wavelength may differ from 2π/k* (the lib tests' tolerance, 20 %: common practice, no source). */
export const LINEAR_THEORY_TOLERANCE = 0.2;
/** Stiffness safety factor of the step rule h ≤ c/ρ (the solver's default, which the CLI uses). */
export const RUN_STIFFNESS_SAFETY = 0.1;

/** Seconds the solver needs for `work` cell-species-steps on `threads` threads. */
export function estimateSolverSeconds(work: number, threads: 1 | 2): number {
  return work / SOLVER_CELL_STEPS_PER_S[threads];
}

/** RUN.json as lib/cli/commands/simulate.ts reads it (see its --help). */
export interface RunSpec {
  kinetics: KineticsSource;
  parameters: Record<string, number>;
  spatialParameters?: Record<string, SpatialParameterField>;
  grid: { lengthUm: number[]; cells: number[]; boundary: "zero-flux" | "periodic" };
  endTimeS: number;
  dtS?: number;
  scheme: "etd2" | "implicit-euler" | "integrating-factor";
  /** Adaptive steps (ETD2RK with embedded ETD1, lib/simulation/step-control.ts); absent: fixed steps. */
  adaptive?: { tolerance: number };
  /**
   * The homogeneous steady state plus seeded noise, or a chosen initial field: `fieldFiles` next to
   * RUN.json (the job writes the earlier run's final fields there, checked against `fromRun.finalSha256`).
   */
  initial:
    | { steadyState: number[]; noiseAmplitude?: number; seed: number }
    | {
        fieldFiles: string[];
        fromRun: { runId: string; name: string; finalSha256: string[] };
        noiseAmplitude: number;
        seed: number;
      };
  stopWhenStationary: boolean;
  snapshotTimesS: number[];
  scales?: { lengthScaleUm?: number; timeScaleS?: number };
}

/** Set when the run started from a fit: the measurement the fit used for this condition (µm). */
export interface RunFromFit {
  fitId: string;
  fitName: string;
  model: string;
  condition: string;
  measuredMeanUm: number;
  measuredSeUm: number;
  n: number;
  readouts: { readoutId: string; filename: string | null; measure: string | null }[];
}

/** Set when the run starts from an earlier run's final fields. */
export interface RunStartFrom {
  runId: string;
  name: string;
  kineticsName: string;
  timeS: number;
  grid: string;
  speciesMeans: number[];
}

/** Checked and predicted before the job starts. Lengths in grid units unless named …Um. */
export interface RunPlan {
  species: string[];
  units: "dimensional" | "non-dimensional";
  /** "µm" when lengths can be shown in µm (dimensional, or a length scale given), else "model length". */
  lengthUnit: "µm" | "model length";
  timeUnit: "s" | "model time";
  /** µm per grid length unit (1 for dimensional kinetics), null without a length scale. */
  lengthFactor: number | null;
  timeFactor: number | null;
  steadyState: number[];
  /** One diffusivity per species, or the full matrix D[i][j] for cross-diffusion. */
  diffusion: number[] | number[][];
  /** Fixed steps: the step and their count. Adaptive steps: the first step, and the count fixed steps would need (an upper bound of the work). */
  dtS: number;
  steps: number;
  /** Adaptive steps: the local error tolerance and the step-size rule in words; null with fixed steps. */
  adaptive?: { tolerance: number; rule: string } | null;
  /** The stationarity criterion of the run, in words, with its tolerance and window. */
  stationarity?: string;
  spectralRadiusPerS: number;
  stiffnessLimitS: number;
  workCellSteps: number;
  /** Estimated solver time (s) on the server's thread count (SIMULATION_THREADS), start-up not included. */
  estimatedCpuS: number;
  classification: string;
  /** Linear theory at the steady state: fastest-growing k* (grid units⁻¹) and 2π/k*; on a zero-flux box also the fastest admissible mode. */
  prediction: {
    kStar: number;
    wavelength: number;
    domainMode: { k: number; wavelength: number; indices: number[]; growing: boolean } | null;
  } | null;
  /** Local 2π/k* along x when a parameter varies (positions in grid units). */
  gradientPrediction: {
    parameter: string;
    positions: number[];
    values: number[];
    wavelengths: Array<number | null>;
  } | null;
  fromFit: RunFromFit | null;
  startFrom: RunStartFrom | null;
  warnings: string[];
}

/** The run as asked (a fit's kinetics, parameters and scales already put in by the caller). */
export interface RunRequest {
  kinetics: CompiledKinetics;
  /** The kinetics' units as the caller's catalogue or stored definition states them. */
  units: KineticsUnits;
  /** Given parameter values by name; the kinetics' defaults fill the rest. */
  parameters: Readonly<Record<string, number>>;
  grid: GridOptions;
  endTimeS: number;
  dtS?: number;
  scheme?: RunSpec["scheme"];
  /** "adaptive" (default with scheme etd2) or "fixed" (the only choice with the first-order schemes). */
  timeStepping?: "adaptive" | "fixed";
  /** Local error tolerance of adaptive steps. @default 1e-3 */
  tolerance?: number;
  /** Snapshots to keep, the last at endTimeS. */
  snapshots: number;
  noiseAmplitude?: number;
  stopWhenStationary?: boolean;
  /** For non-dimensional kinetics: µm and s per model unit. */
  lengthScaleUm?: number;
  timeScaleS?: number;
  /**
   * One parameter varying along x. `readShape` is called when the plan reaches the gradient, so a
   * malformed table is reported after the checks before it, in the order users have always seen.
   */
  gradient?: { parameter: string; readShape: () => GradientShape };
}

/** The first step's result: parameters, grid and linear theory at the homogeneous steady state. */
export interface RunSteadyState {
  request: RunRequest;
  dimensional: boolean;
  scales: { lengthScaleUm?: number; timeScaleS?: number };
  /** Parameter values in the kinetics' order, and by name. */
  values: Float64Array;
  params: Record<string, number>;
  grid: Grid;
  dispersion: DispersionResult;
  steadyState: number[];
}

/** Where the run starts besides the steady state: an earlier run's final fields, read by the caller. */
export interface RunStartInput {
  plan: RunStartFrom;
  fromRun: { runId: string; name: string; finalSha256: string[] };
  /** The file names of the fields beside RUN.json, one per species. */
  fieldFiles: string[];
  warnings: string[];
}

/** What the caller adds to step 2: the start, the fit reference, the seed and the server's threads. */
export interface RunPlanContext {
  start: RunStartInput | null;
  fromFit: RunFromFit | null;
  kineticsSource: RunSpec["kinetics"];
  seed: number;
  threads: 1 | 2;
}
