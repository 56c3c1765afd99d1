import { failOption } from "./errors";
import type { DiffusionExecutor } from "./executor";
import { createGrid, type Grid, type GridOptions } from "./grid";
import type { InitialState } from "./initial-state";
import { SIMULATION_LIMITS } from "./limits";
import { SCHEME_NAMES, type SchemeName } from "./schemes";
import type { ReactionParams } from "./reaction-system";
import { evaluateSpatialParameterField, type SpatialParameterField } from "./spatial-parameters";

/** Progress report, given every `progressEverySteps` steps and at the end. */
export interface SimulationProgress {
  /** Simulated time reached (s). */
  timeS: number;
  /** timeS / endTimeS, 0 … 1. */
  fraction: number;
  /** 100 · fraction. */
  percent: number;
  steps: number;
  /** The step just taken (s). */
  dtS: number;
}

/** Adaptive time steps (ETD2RK with embedded ETD1, step-control.ts); only with scheme `etd2`. */
export interface AdaptiveStepOptions {
  /** Relative tolerance rtol of the local error per step. @default 1e-3 */
  tolerance?: number;
}

/** Stationarity criterion (see README): relative L2 change per unit time over one window. */
export interface StationarityOptions {
  /** Threshold of ‖c(t) − c(t − W)‖₂ / (‖c(t)‖₂ W) (1/s). @default 1e-5 · max(ρ, 1/endTimeS) */
  tolerancePerS?: number;
  /** Window W (s), rounded to whole steps. @default 10/ρ (endTimeS/20 when ρ = 0), at least one step */
  windowS?: number;
  /** No stationarity stop before this time (s). @default 0 */
  minTimeS?: number;
}

/** Options of {@link simulateReactionDiffusion}. */
export interface SimulationOptions {
  grid: GridOptions;
  /**
   * Diffusivities (µm²/s, or model units): one per species (diagonal), or a full n×n matrix
   * D[i][j] (row i = species i) for cross-diffusion, simulated in the eigen-coordinates of D
   * (cross-diffusion.ts; D must have real eigenvalues ≥ 0).
   */
  diffusionUm2PerS: readonly number[] | readonly (readonly number[])[];
  /** Uniform parameter values by name. @default {} */
  params?: Readonly<Record<string, number>>;
  /** Parameters varying in space; they override `params` of the same name. @default {} */
  spatialParams?: Readonly<Record<string, SpatialParameterField>>;
  initial: InitialState;
  /** Simulated time at which the run stops (s). */
  endTimeS: number;
  /** Cap on the time step (s). @default none (the stiffness rule alone) */
  dtS?: number;
  /**
   * Adaptive steps with local error control (step-control.ts); the first step follows the step
   * rule, `dtS` caps every step. @default none (fixed steps)
   */
  adaptive?: AdaptiveStepOptions;
  /** Factor c of the stiffness rule h ≤ c/ρ. @default 0.1 */
  stiffnessSafety?: number;
  /** @default "etd2" */
  scheme?: SchemeName;
  /** Stop as soon as the stationarity criterion holds. @default false */
  stopWhenStationary?: boolean;
  stationarity?: StationarityOptions;
  /** Times (s) at which to keep a copy of the fields; taken at the first step at or after each. @default [] */
  snapshotTimesS?: readonly number[];
  /** A field value with |c| above this counts as blow-up. @default 1e12 */
  blowUpAbs?: number;
  onProgress?: (progress: SimulationProgress) => void;
  /** @default ⌈steps/100⌉ */
  progressEverySteps?: number;
  /** Checked between steps; an aborted signal stops the run with reason `cancelled`. */
  signal?: AbortSignal;
  /** Checked between steps; returning true stops the run with reason `cancelled`. */
  shouldStop?: () => boolean;
  /** Where the spectral stage runs. @default the serial executor */
  executor?: DiffusionExecutor;
}

/** The options of one run, checked, with what needs the grid worked out: what the solver runs on. */
export interface ResolvedSimulationOptions {
  grid: Grid;
  /** Scalar parameters, and spatial parameter fields evaluated at every cell. */
  params: ReactionParams;
}

/**
 * Checks and resolves a run's options once, at the top of simulateReactionDiffusion: the options
 * that need no grid, then the grid, then the spatial parameter fields on it. Throws
 * SimulationOptionError naming the field and the limit.
 */
export function resolveSimulationOptions(options: SimulationOptions, species: number): ResolvedSimulationOptions {
  checkGridFreeOptions(options, species);
  const grid = createGrid(options.grid);
  const params: Record<string, number | Float64Array> = { ...(options.params ?? {}) };
  for (const [name, field] of Object.entries(options.spatialParams ?? {})) {
    params[name] = evaluateSpatialParameterField(field, grid, `spatialParams.${name}`);
  }
  return { grid, params };
}

/** The options that need no grid or reaction system. */
function checkGridFreeOptions(options: SimulationOptions, species: number): void {
  if (!Number.isInteger(species) || species < 1 || species > SIMULATION_LIMITS.maxSpecies) {
    failOption(
      "system.species",
      `system.species must be an integer from 1 to ${SIMULATION_LIMITS.maxSpecies}, got ${species}.`,
    );
  }
  const d = options.diffusionUm2PerS;
  if (!Array.isArray(d) || d.length !== species) {
    failOption(
      "diffusionUm2PerS",
      `diffusionUm2PerS must have ${species} values (one per species), got ${Array.isArray(d) ? d.length : typeof d}.`,
    );
  }
  if (Array.isArray(d[0])) {
    (d as readonly (readonly number[])[]).forEach((row, i) => {
      if (!Array.isArray(row) || row.length !== species) {
        failOption(
          "diffusionUm2PerS",
          `diffusionUm2PerS[${i}] must be a row of ${species} values (a ${species}×${species} matrix), got ${Array.isArray(row) ? row.length : typeof row}.`,
        );
      }
      row.forEach((v, j) => {
        if (!Number.isFinite(v))
          failOption("diffusionUm2PerS", `diffusionUm2PerS[${i}][${j}] must be a finite number, got ${v}.`);
        if (i === j && v < 0) failOption("diffusionUm2PerS", `diffusionUm2PerS[${i}][${i}] must be ≥ 0, got ${v}.`);
      });
    });
  } else {
    (d as readonly number[]).forEach((v, s) => {
      if (typeof v !== "number" || !Number.isFinite(v) || v < 0)
        failOption("diffusionUm2PerS", `diffusionUm2PerS[${s}] must be a finite number ≥ 0, got ${v}.`);
    });
  }
  positive(options.endTimeS, "endTimeS");
  if (options.dtS !== undefined) positive(options.dtS, "dtS");
  const safety = options.stiffnessSafety;
  if (safety !== undefined && !(safety > 0 && safety <= 2)) {
    failOption("stiffnessSafety", `stiffnessSafety must be in (0, 2], got ${safety}.`);
  }
  if (options.scheme !== undefined && !SCHEME_NAMES.includes(options.scheme)) {
    failOption("scheme", `scheme must be one of ${SCHEME_NAMES.join(", ")}, got ${String(options.scheme)}.`);
  }
  if (options.adaptive !== undefined) {
    if ((options.scheme ?? "etd2") !== "etd2")
      failOption("adaptive", `adaptive steps need scheme etd2 (ETD2RK with embedded ETD1), got ${options.scheme}.`);
    const tol = options.adaptive.tolerance;
    if (tol !== undefined && !(tol > 0 && tol <= 0.1))
      failOption("adaptive.tolerance", `adaptive.tolerance must be in (0, 0.1], got ${tol}.`);
  }
  for (const [name, v] of Object.entries(options.params ?? {})) {
    if (!Number.isFinite(v)) failOption(`params.${name}`, `params.${name} must be a finite number, got ${v}.`);
  }
  const st = options.stationarity ?? {};
  if (st.tolerancePerS !== undefined) positive(st.tolerancePerS, "stationarity.tolerancePerS");
  if (st.windowS !== undefined) positive(st.windowS, "stationarity.windowS");
  if (st.minTimeS !== undefined && !(st.minTimeS >= 0))
    failOption("stationarity.minTimeS", `stationarity.minTimeS must be ≥ 0, got ${st.minTimeS}.`);
  const snaps = options.snapshotTimesS ?? [];
  if (snaps.length > SIMULATION_LIMITS.maxSnapshots) {
    failOption(
      "snapshotTimesS",
      `snapshotTimesS may list at most ${SIMULATION_LIMITS.maxSnapshots} times, got ${snaps.length}.`,
    );
  }
  snaps.forEach((t, i) => {
    if (!(t >= 0 && t <= options.endTimeS))
      failOption("snapshotTimesS", `snapshotTimesS[${i}] must be in [0, endTimeS = ${options.endTimeS}], got ${t}.`);
    if (i > 0 && !(t > snaps[i - 1])) failOption("snapshotTimesS", "snapshotTimesS must increase strictly.");
  });
  if (options.blowUpAbs !== undefined) positive(options.blowUpAbs, "blowUpAbs");
  const pe = options.progressEverySteps;
  if (pe !== undefined && !(Number.isInteger(pe) && pe >= 1))
    failOption("progressEverySteps", `progressEverySteps must be an integer ≥ 1, got ${pe}.`);
}

function positive(v: number, field: string): void {
  if (!(Number.isFinite(v) && v > 0)) failOption(field, `${field} must be a positive finite number, got ${v}.`);
}
