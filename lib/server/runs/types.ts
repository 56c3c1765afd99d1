/**
 * Shapes of a verification run: the stored spec (the `simulate` CLI's RUN.json), the plan made
 * before the job, the stored result, and the DTOs the API returns. Types only, so pages may import them.
 */
import "server-only";
import type { RunPlan, RunSpec } from "@/lib/simulation";
import type { JobStatus } from "@/models/job";
import type { ImageReadoutResult } from "../readouts/result";

/** RUN.json and the plan shown before the job: the science core makes both (lib/simulation/plan-run.ts). */
export type { RunPlan, RunSpec };

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
  /** Adaptive steps: tolerance, rule, accepted and rejected steps, smallest, largest and last step; absent with fixed steps. */
  adaptive?: {
    tolerance: number;
    rule: string;
    acceptedSteps: number;
    rejectedSteps: number;
    firstStepS: number;
    smallestStepS: number;
    largestStepS: number;
    lastStepS: number;
  } | null;
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
  /** The run this one was changed from ("Change and run again"), and the runs changed from this one. */
  changedFrom: RunLinkDto | null;
  changedInto: RunLinkDto[];
}

/** Another run of the lab, as a link. */
export interface RunLinkDto {
  id: string;
  name: string;
  status: JobStatus;
}
