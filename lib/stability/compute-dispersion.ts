/**
 * The dispersion relation of a kinetics at one parameter set (SCIENCE.md §1–3): steady
 * state, Jacobian, σ(k), classification, fastest-growing mode k*, unstable band, predicted
 * wavelength 2π/k* (model units and µm), closed-form Turing conditions (2 species), and on a
 * bounded domain the fastest admissible mode and its repeats.
 */
import { KineticsInputError } from "../kinetics/errors";
import { resolveParameters } from "../kinetics/parameters";
import type { CompiledKinetics, PhysicalScales } from "../kinetics/types";
import { analyseState, type ScanOptions, type StateAnalysis } from "./analyse-state";
import { classLabel, classNames, isStableAtZero, isTuring, type InstabilityClass } from "./classes";
import { describeDomain, type DomainResult } from "./describe-domain";
import type { DomainSpec } from "./domains";
import { growthRatePerS, resolveScales, wavelengthUm, wavenumberPerUm, type ResolvedScales } from "./scales";
import { findSteadyStates, type SteadyState, type SteadyStateOptions } from "./steady-states";
import { computeTuringConditions, type TwoSpeciesTuringConditions } from "./turing-conditions";

export interface DispersionOptions extends ScanOptions, PhysicalScales {
  /** Which steady state: an index into the found states, or "auto" (see {@link pickSteadyState}). @default "auto" */
  steadyState?: number | "auto";
  /** A bounded domain; sizes in µm when a length scale is known, else model units (see DomainSpec.units). */
  domain?: DomainSpec;
  steadyStateSearch?: SteadyStateOptions;
}

export interface GrowthPeak {
  kind: "turing" | "wave";
  kStar: number;
  sigmaStar: number;
  imSigmaStar: number;
  wavelength: number;
  kStarPerUm: number | null;
  wavelengthUm: number | null;
  growthRatePerS: number | null;
}

export interface DispersionResult {
  kinetics: { id: string; name: string; species: string[] };
  parameters: Record<string, number>;
  scales: ResolvedScales;
  steadyState: { index: number; values: Record<string, number> };
  steadyStates: (SteadyState & { classes: InstabilityClass[] })[];
  jacobian: number[][];
  diffusion: number[][];
  classification: { classes: InstabilityClass[]; label: string; flags: number; marginal: boolean };
  /** Fastest-growing mode at k > 0 (the largest local maximum of σ_max), or null. */
  fastest: GrowthPeak | null;
  peaks: GrowthPeak[];
  /** Unstable bands (σ_max > 0), model units⁻¹ and 1/µm. */
  bands: { kLow: number; kHigh: number; kLowPerUm: number | null; kHighPerUm: number | null }[];
  turingConditions: TwoSpeciesTuringConditions | null;
  domain: DomainResult | null;
  curve: { k: number[]; sigma: number[]; imSigma: number[] };
  kMax: number;
}

/** The wavenumber grid of DispersionOptions, checked, its default filled in. */
export interface ResolvedDispersionOptions {
  gridSize: number;
  kMax: number | undefined;
}

/** Checks and defaults the wavenumber grid once, before any work; throws KineticsInputError naming the option. */
export function resolveDispersionOptions(options: DispersionOptions): ResolvedDispersionOptions {
  const gridSize = options.gridSize ?? 200;
  if (!Number.isInteger(gridSize) || gridSize < 16 || gridSize > 100_000) {
    throw new KineticsInputError("gridSize", `gridSize must be an integer from 16 to 100000 (got ${gridSize}).`);
  }
  if (options.kMax !== undefined && !(Number.isFinite(options.kMax) && options.kMax > 0)) {
    throw new KineticsInputError("kMax", `kMax must be a positive finite number (got ${options.kMax}).`);
  }
  return { gridSize, kMax: options.kMax };
}

/** Computes the dispersion relation; `parameters` overrides the kinetics' defaults by name. */
export function computeDispersion(
  kinetics: CompiledKinetics,
  parameters: Readonly<Record<string, number>> = {},
  options: DispersionOptions = {},
): DispersionResult {
  const { gridSize, kMax } = resolveDispersionOptions(options);
  const p = resolveParameters(kinetics, parameters);
  const scales = resolveScales(kinetics, options);
  const states = findSteadyStates(kinetics, p, options.steadyStateSearch);
  const analyses = states.map((s) => analyseState(kinetics, p, s.values, { gridSize, kMax }));
  const index = pickSteadyState(analyses, options.steadyState ?? "auto");
  const a = analyses[index];
  const n = kinetics.species.length;
  const matrix = (m: Float64Array) => Array.from({ length: n }, (_, i) => Array.from(m.subarray(i * n, i * n + n)));
  const peak = (q: { kind: "turing" | "wave"; k: number; sigma: number; imSigma: number }): GrowthPeak => ({
    kind: q.kind,
    kStar: q.k,
    sigmaStar: q.sigma,
    imSigmaStar: q.imSigma,
    wavelength: (2 * Math.PI) / q.k,
    kStarPerUm: wavenumberPerUm(q.k, scales),
    wavelengthUm: wavelengthUm(q.k, scales),
    growthRatePerS: growthRatePerS(q.sigma, scales),
  });
  let maxSigma = -Infinity;
  for (let i = 0; i < a.ws.size; i++) maxSigma = Math.max(maxSigma, a.ws.re[i]);
  return {
    kinetics: { id: kinetics.id, name: kinetics.name, species: [...kinetics.species] },
    parameters: Object.fromEntries(kinetics.parameters.map((s, i) => [s.name, p[i]])),
    scales,
    steadyState: { index, values: Object.fromEntries(kinetics.species.map((s, i) => [s, states[index].values[i]])) },
    steadyStates: states.map((s, i) => ({ ...s, classes: classNames(analyses[i].flags) })),
    jacobian: matrix(a.ws.J),
    diffusion: matrix(a.ws.D),
    classification: {
      classes: classNames(a.flags),
      label: classLabel(a.flags),
      flags: a.flags,
      marginal: Math.abs(maxSigma) <= a.tol,
    },
    fastest: a.fastest ? peak(a.fastest) : null,
    peaks: a.peaks.map(peak),
    bands: a.bands.map(([lo, hi]) => ({
      kLow: lo,
      kHigh: hi,
      kLowPerUm: wavenumberPerUm(lo, scales),
      kHighPerUm: wavenumberPerUm(hi, scales),
    })),
    turingConditions:
      n === 2 && kinetics.diagonalDiffusion ? computeTuringConditions(a.ws.J, a.ws.D[0], a.ws.D[3]) : null,
    domain: options.domain ? describeDomain(a, options.domain, scales) : null,
    curve: {
      k: Array.from(a.ws.k.subarray(0, a.ws.size)),
      sigma: Array.from(a.ws.re.subarray(0, a.ws.size)),
      imSigma: Array.from(a.ws.im.subarray(0, a.ws.size)),
    },
    kMax: a.kMax,
  };
}

/**
 * Chooses the steady state to analyse. "auto" (a design choice): the first state that is
 * stable without diffusion and Turing unstable; else the first stable without diffusion;
 * else the first. An index picks that state.
 */
export function pickSteadyState(analyses: Pick<StateAnalysis, "flags">[], choice: number | "auto"): number {
  if (choice !== "auto") {
    if (!Number.isInteger(choice) || choice < 0 || choice >= analyses.length) {
      throw new KineticsInputError(
        "steadyState",
        `steadyState must be "auto" or an index from 0 to ${analyses.length - 1} (got ${choice}).`,
      );
    }
    return choice;
  }
  const turing = analyses.findIndex((a) => isTuring(a.flags));
  if (turing >= 0) return turing;
  const stable = analyses.findIndex((a) => isStableAtZero(a.flags));
  return stable >= 0 ? stable : 0;
}
