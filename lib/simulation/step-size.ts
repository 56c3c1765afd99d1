import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import type { ReactionParams, ReactionSystem } from "./reaction-system";

/**
 * Jacobian ∂R_i/∂c_j at one state (row-major n×n): the system's own when it has one, else
 * central differences with step 1e-6·max(1, |c_j|) (common practice, no source).
 */
export function computeReactionJacobian(
  system: ReactionSystem,
  state: readonly number[],
  params: Readonly<Record<string, number>>,
): Float64Array {
  const n = system.species;
  const out = new Float64Array(n * n);
  if (system.jacobian) {
    system.jacobian(state, params, out);
    return out;
  }
  const plus = state.map((c) => Float64Array.of(c)),
    minus = state.map((c) => Float64Array.of(c));
  const rp = state.map(() => new Float64Array(1)),
    rm = state.map(() => new Float64Array(1));
  for (let j = 0; j < n; j++) {
    const h = 1e-6 * Math.max(1, Math.abs(state[j]));
    plus[j][0] = state[j] + h;
    minus[j][0] = state[j] - h;
    system.evaluate(plus, params, rp);
    system.evaluate(minus, params, rm);
    for (let i = 0; i < n; i++) out[i * n + j] = (rp[i][0] - rm[i][0]) / (2 * h);
    plus[j][0] = state[j];
    minus[j][0] = state[j];
  }
  return out;
}

/** Spectral radius max |λ| of a row-major n×n matrix (ml-matrix eigenvalues). */
export function computeSpectralRadius(matrix: Float64Array, n: number): number {
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, matrix[i * n + j]);
  const evd = new EigenvalueDecomposition(m);
  let rho = 0;
  evd.realEigenvalues.forEach((re, i) => {
    rho = Math.max(rho, Math.hypot(re, evd.imaginaryEigenvalues[i]));
  });
  return rho;
}

/**
 * Reaction stiffness ρ (1/s): the largest spectral radius of the Jacobian at `state` over up to
 * 9 evenly spaced sample cells (parameters varying in space change J from cell to cell).
 */
export function computeReactionStiffness(
  system: ReactionSystem,
  state: readonly number[],
  params: ReactionParams,
  cellCount: number,
): number {
  const spatial = Object.values(params).some((v) => typeof v !== "number");
  const samples = spatial ? Math.min(9, cellCount) : 1;
  let rho = 0;
  for (let q = 0; q < samples; q++) {
    const cell = samples === 1 ? 0 : Math.round((q * (cellCount - 1)) / (samples - 1));
    const p: Record<string, number> = {};
    for (const [k, v] of Object.entries(params)) p[k] = typeof v === "number" ? v : v[cell];
    rho = Math.max(rho, computeSpectralRadius(computeReactionJacobian(system, state, p), system.species));
  }
  return rho;
}

/** Time-step decision, reported in the result. */
export interface TimeStepRule {
  /** The step used (s): endTimeS / steps. */
  dtS: number;
  /** Steps to reach the end time. */
  steps: number;
  /** ρ of the Jacobian at the reference state (1/s). */
  spectralRadiusPerS: number;
  /** safety / ρ (s), Infinity when ρ = 0. */
  stiffnessLimitS: number;
  /** The caller's cap (s), if any. */
  userDtS: number | null;
}

/**
 * Step rule: h = min(userDtS, safety/ρ), then shortened to endTimeS / ⌈endTimeS / h⌉ so whole
 * steps end exactly at endTimeS. Explicit Euler on a reaction eigenvalue λ is stable only for
 * |1 + hλ| < 1 (h < 2/|λ| for real λ); safety = 0.1 keeps the reaction error well inside that.
 */
export function chooseTimeStep(
  endTimeS: number,
  spectralRadiusPerS: number,
  safety: number,
  userDtS: number | null,
): Omit<TimeStepRule, "steps"> & { steps: number } {
  const stiffnessLimitS = spectralRadiusPerS > 0 ? safety / spectralRadiusPerS : Infinity;
  const h = Math.min(userDtS ?? Infinity, stiffnessLimitS, endTimeS);
  const steps = Math.ceil(endTimeS / h - 1e-9);
  return { dtS: endTimeS / steps, steps, spectralRadiusPerS, stiffnessLimitS, userDtS };
}
