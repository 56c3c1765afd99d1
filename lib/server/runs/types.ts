/**
 * Shapes of a verification run: the stored spec (the `simulate` CLI's RUN.json), the plan made
 * before the job, the stored result, and the DTOs the API returns. Types only, so pages may import them.
 */
import "server-only";
import type { KineticsDefinition } from "@/lib/kinetics";
import type { ParameterProfile } from "@/lib/simulation";
import type { JobStatus } from "@/models/job";
import type { ImageReadoutResult } from "../readouts/result";

/** RUN.json as lib/cli/commands/simulate.ts reads it (see its --help). */
export interface RunSpec {
  kinetics: { catalogue: string } | { definition: KineticsDefinition };
  parameters: Record<string, number>;
  spatialParameters?: Record<string, ParameterProfile>;
  grid: { lengthUm: number[]; cells: number[]; boundary: "zero-flux" | "periodic" };
  endTimeS: number;
  dtS?: number;
  scheme: "etd2" | "implicit-euler" | "integrating-factor";
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
  dtS: number;
  steps: number;
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
  /** Set when the run started from a fit: the measurement the fit used for this condition (µm). */
  fromFit: {
    fitId: string;
    fitName: string;
    model: string;
    condition: string;
    measuredMeanUm: number;
    measuredSeUm: number;
    n: number;
    readouts: { readoutId: string; filename: string | null; measure: string | null }[];
  } | null;
  /** Set when the run starts from an earlier run's final fields. */
  startFrom: {
    runId: string;
    name: string;
    kineticsName: string;
    timeS: number;
    grid: string;
    speciesMeans: number[];
  } | null;
  warnings: string[];
}

export interface RunSnapshot {
  requestedTimeS: number;
  timeS: number;
  step: number;
  /** Per species: min and max of the field (the colour scale of its image). */
  range: { min: number; max: number }[];
}

export interface RunComparison {
  /** Same unit as RunPlan.lengthUnit. */
  simulatedWavelength: number | null;
  uncertainty: number | null;
  predictedWavelength: number;
  relativeDifference: number | null;
  /** |λ_sim − 2π/k*| ≤ 2u (two standard uncertainties). */
  withinUncertainty: boolean | null;
  /** |λ_sim − 2π/k*| ≤ 20 % of 2π/k*. */
  withinLinearTolerance: boolean | null;
  sentence: string;
}

export interface RunResult {
  stopReason: "end-time" | "stationary" | "cancelled" | "blow-up";
  message: string;
  timeS: number;
  steps: number;
  dtS: number;
  stationary: boolean;
  lastChangeRatePerS: number | null;
  blowUp: { step: number; timeS: number; lastGoodTimeS: number; maxAbs: number } | null;
  fields: { species: string; min: number; max: number; mean: number }[];
  snapshots: RunSnapshot[];
  /** The tissue readout of species 0's final field (pixel size = cell size in grid units). */
  readout: ImageReadoutResult | null;
  readoutSkipped: string | null;
  comparison: RunComparison | null;
  /** Against the fit's measured mean (µm), when the run started from a fit and a length scale is known. */
  measurementComparison: RunComparison | null;
  /** SHA-256 of each species' final field bytes (float64, little-endian): equal seeds give equal hashes. */
  finalSha256: string[];
  /** Wall-clock time of the simulation process (s), start-up included. */
  wallS: number;
}

export interface RunDto {
  id: string;
  name: string;
  status: JobStatus;
  progress: number;
  progressNote: string | null;
  error: string | null;
  jobId: string | null;
  kinetics: { kind: "catalogue" | "lab"; ref: string; version: number | null; name: string };
  gridLabel: string;
  endTimeS: number;
  seed: string;
  stopReason: string | null;
  wavelength: number | null;
  uncertainty: number | null;
  predictedWavelength: number | null;
  lengthUnit: string;
  agrees: boolean | null;
  softwareVersion: string;
  createdByEmail: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface RunDetailDto extends RunDto {
  spec: RunSpec;
  plan: RunPlan;
  result: RunResult | null;
  /** API paths of stored files by name (final-0.png, snapshot-3-1.png, spectrum.json, …). */
  files: Record<string, string>;
  canCancel: boolean;
}
