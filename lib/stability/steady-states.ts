/**
 * Homogeneous steady states R(c*) = 0: the closed form where the kinetics has one, otherwise
 * damped Newton from deterministic seeded starts (log-uniform over 1e-3…1e3 per species plus
 * a few uniform vectors), deduplicated; each state is reported with its stability at k = 0.
 */
import seedrandom from "seedrandom";
import { KineticsAnalysisError } from "../kinetics/errors";
import type { CompiledKinetics } from "../kinetics/types";
import { eigenvalues } from "./eigen";
import { createNewtonWorkspace, runNewton } from "./newton";

/** Most steady states a closed form may write. */
export const MAX_STEADY_STATES = 8;

export interface SteadyStateOptions {
  /** Newton starting points besides the fixed ones. @default 48 */
  starts?: number;
  /** Seed of the start generator (results are deterministic). @default "morphokin-steady-states" */
  seed?: string;
}

export interface SteadyState {
  /** c* in species order. */
  values: number[];
  /** Eigenvalues of J at c*, sorted by decreasing real part. */
  eigenvalues: { re: number; im: number }[];
  /** max Re eig J (model time units⁻¹). */
  maxRealEigenvalue: number;
  /** True when every eigenvalue of J has negative real part. */
  stableWithoutDiffusion: boolean;
  method: "closed-form" | "newton";
}

/** Finds the steady states; throws {@link KineticsAnalysisError} (field `steadyState`) when none. */
export function findSteadyStates(
  kinetics: CompiledKinetics,
  p: ArrayLike<number>,
  options: SteadyStateOptions = {},
): SteadyState[] {
  const n = kinetics.species.length;
  const raw: number[][] = [];
  let method: SteadyState["method"] = "newton";
  if (kinetics.steadyStates) {
    method = "closed-form";
    const buf = new Float64Array(n * MAX_STEADY_STATES);
    const m = kinetics.steadyStates(p, buf);
    for (let s = 0; s < m; s++) raw.push(Array.from(buf.subarray(s * n, s * n + n)));
  } else {
    raw.push(...newtonMultiStart(kinetics, p, options));
  }
  const accepted = raw
    .filter((c) => c.every(Number.isFinite))
    .map((c) => (kinetics.nonNegative ? c.map((x) => (x < 0 && x > -1e-9 * (1 + Math.abs(x)) ? 0 : x)) : c))
    .filter((c) => !kinetics.nonNegative || c.every((x) => x >= 0));
  if (accepted.length === 0) {
    const how =
      method === "closed-form"
        ? `the closed form of ${kinetics.name} has no${kinetics.nonNegative ? " non-negative" : ""} solution for these parameters`
        : `Newton's method from ${startCount(options)} seeded starting points found no${kinetics.nonNegative ? " non-negative" : ""} solution`;
    throw new KineticsAnalysisError("steadyState", `No homogeneous steady state: ${how}.`);
  }
  const J = new Float64Array(n * n);
  return accepted.map((values) => {
    kinetics.jacobian(values, p, J);
    const e = eigenvalues(J, n);
    const eig = e.re.map((re, i) => ({ re, im: e.im[i] }));
    const maxRe = e.re[0];
    return { values, eigenvalues: eig, maxRealEigenvalue: maxRe, stableWithoutDiffusion: maxRe < 0, method };
  });
}

function startCount(options: SteadyStateOptions): number {
  return (options.starts ?? 48) + 5;
}

function newtonMultiStart(kinetics: CompiledKinetics, p: ArrayLike<number>, options: SteadyStateOptions): number[][] {
  const n = kinetics.species.length;
  const rng = seedrandom(options.seed ?? "morphokin-steady-states");
  const starts: number[][] = [0.1, 0.5, 1, 2, 10].map((v) => new Array(n).fill(v));
  for (let s = 0; s < (options.starts ?? 48); s++) {
    starts.push(
      Array.from({ length: n }, () => (kinetics.nonNegative ? 1 : rng() < 0.5 ? -1 : 1) * Math.pow(10, -3 + 6 * rng())),
    );
  }
  const ws = createNewtonWorkspace(n);
  const found: number[][] = [];
  for (const start of starts) {
    ws.x.set(start);
    if (!runNewton(kinetics, p, ws)) continue;
    const x = Array.from(ws.x);
    const scale = 1 + Math.max(...x.map(Math.abs));
    if (!found.some((y) => y.every((v, i) => Math.abs(v - x[i]) <= 1e-6 * scale))) found.push(x);
  }
  return found.sort((a, b) => {
    for (let i = 0; i < n; i++) if (a[i] !== b[i]) return a[i] - b[i];
    return 0;
  });
}
