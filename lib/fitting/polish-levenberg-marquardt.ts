import { Matrix, QrDecomposition } from "ml-matrix";
import { computeJacobian, type ResidualFunction } from "./jacobian";
import { clampToBox, type ParameterSpace } from "./parameter-space";
import { CONVERGED_REASONS, type SolverStopReason } from "./types";

/** A column below this fraction of its largest norm seen during the run counts as saturated. */
const SATURATION = 1e-10;

/** Tolerances of the polishing stage (all dimensionless). */
export interface PolishOptions {
  /** Iteration cap (one Jacobian per iteration). @default 200 */
  maxIterations: number;
  /** Stop when actual and predicted relative χ² reductions are both below this. @default 1e-14 */
  relativeReduction: number;
  /** Stop when the scaled step ‖Dδ‖ ≤ tol·(‖Du‖ + tol). @default 1e-12 */
  stepTolerance: number;
  /** Stop when every free |gⱼ|/(‖Jⱼ‖·‖r‖) (cosine of residual and column) is below this. @default 1e-12 */
  gradientTolerance: number;
  /** Starting damping, relative to the scaled diagonal. @default 1e-3 */
  initialDamping: number;
  /** Report `diverged` when some |uⱼ| exceeds this many typical magnitudes. @default 1e12 */
  divergenceFactor: number;
}

export const DEFAULT_POLISH: PolishOptions = {
  maxIterations: 200,
  relativeReduction: 1e-14,
  stepTolerance: 1e-12,
  gradientTolerance: 1e-12,
  initialDamping: 1e-3,
  divergenceFactor: 1e12,
};

/** Jacobian provider in solver coordinates (analytic or finite differences). */
export type JacobianProvider = (u: readonly number[], r: Float64Array) => { jacobian: Matrix; evaluations: number };

export interface PolishResult {
  u: number[];
  residuals: Float64Array;
  chiSquare: number;
  reason: SolverStopReason;
  iterations: number;
  evaluations: number;
}

function sumSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return Number.isFinite(s) ? s : Infinity;
}

function norm(v: readonly number[]): number {
  return Math.sqrt(v.reduce((s, x) => s + x * x, 0));
}

/**
 * Bounded Levenberg–Marquardt refinement. Each step solves the damped problem
 * min ‖Jδ + r‖² + λ‖Dδ‖² as an augmented least-squares system by QR (not via the normal equations,
 * which square the condition number), with Moré's scaling D = running max of column norms
 * (Moré 1978, in Numerical Analysis, Springer LNM 630:105–116) and Nielsen's damping update
 * λ ← λ·max(1/3, 1 − (2ρ − 1)³) (Nielsen 1999, IMM-REP-1999-05). Bounds: coordinates on a bound whose
 * gradient points outward are held (active set), the rest of the step is projected onto the box.
 */
export function polishLevenbergMarquardt(
  f: ResidualFunction,
  u0: readonly number[],
  space: ParameterSpace,
  typical: readonly number[],
  options: PolishOptions = DEFAULT_POLISH,
  jacobianOf?: JacobianProvider,
): PolishResult {
  const p = u0.length;
  const jac: JacobianProvider = jacobianOf ?? ((u, r) => computeJacobian(f, u, r, space, typical));
  let u = clampToBox(space, u0);
  let r = f(u);
  let evaluations = 1;
  let chi = sumSquares(r);
  const D = new Array<number>(p).fill(0);
  const colNorm = new Array<number>(p).fill(0);
  // A parameter whose Jacobian column has fallen to ~0 after having mattered has drifted onto a
  // plateau (e.g. exp(−b·x) underflowed for huge b): its "minimum" is an artefact, not a fit.
  const saturated = () => colNorm.some((c, j) => D[j] > 0 && c <= SATURATION * D[j]);
  const done = (reason: SolverStopReason, iterations: number): PolishResult => ({
    u,
    residuals: r,
    chiSquare: chi,
    reason: CONVERGED_REASONS.includes(reason) && iterations > 0 && saturated() ? "saturated" : reason,
    iterations,
    evaluations,
  });
  if (!Number.isFinite(chi)) return done("non-finite-start", 0);
  const zeroLevel = 1e-28 * r.length;
  if (chi <= zeroLevel) return done("zero-residual", 0);
  let lambda = options.initialDamping;
  let nu = 2;
  for (let iter = 1; iter <= options.maxIterations; iter++) {
    const { jacobian: J, evaluations: used } = jac(u, r);
    evaluations += used;
    const g = new Array<number>(p).fill(0);
    for (let j = 0; j < p; j++) {
      colNorm[j] = 0;
      for (let i = 0; i < r.length; i++) {
        g[j] += J.get(i, j) * r[i];
        colNorm[j] += J.get(i, j) ** 2;
      }
      colNorm[j] = Math.sqrt(colNorm[j]);
      D[j] = Math.max(D[j], colNorm[j]);
    }
    const dFloor = Math.max(...D) * 1e-12 || 1;
    const scale = D.map((d) => Math.max(d, dFloor));
    const free: number[] = [];
    for (let j = 0; j < p; j++) {
      const heldLow = u[j] <= space.lowerU[j] && g[j] > 0;
      const heldHigh = u[j] >= space.upperU[j] && g[j] < 0;
      if (!heldLow && !heldHigh) free.push(j);
    }
    const rNorm = Math.sqrt(chi);
    const cosMax = Math.max(0, ...free.map((j) => (colNorm[j] > 0 ? Math.abs(g[j]) / (colNorm[j] * rNorm) : 0)));
    // A point where no free parameter moves χ² at all is a plateau (e.g. an exponential that has
    // underflowed), not a minimum: report it as stalled rather than converged.
    if (free.length > 0 && free.every((j) => colNorm[j] === 0)) return done("stalled", iter - 1);
    if (free.length === 0 || cosMax <= options.gradientTolerance) return done("gradient", iter - 1);
    for (;;) {
      const delta = solveDampedStep(J, r, free, scale, lambda, p);
      const trial = delta
        ? clampToBox(
            space,
            u.map((v, j) => v + delta[j]),
          )
        : null;
      if (trial) {
        const step = trial.map((v, j) => (v - u[j]) * scale[j]);
        const uScaled = u.map((v, j) => v * scale[j]);
        if (norm(step) <= options.stepTolerance * (norm(uScaled) + options.stepTolerance))
          return done("step-size", iter);
        const rt = f(trial);
        evaluations++;
        const chiT = sumSquares(rt);
        const predicted = chi - linearisedSumSquares(J, r, trial, u);
        if (chiT < chi) {
          const rho = predicted > 0 ? (chi - chiT) / predicted : 1;
          const small =
            chi - chiT <= options.relativeReduction * chi && Math.abs(predicted) <= options.relativeReduction * chi;
          u = trial;
          r = rt;
          chi = chiT;
          lambda *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
          nu = 2;
          if (chi <= zeroLevel) return done("zero-residual", iter);
          if (small && rho <= 2) return done("relative-reduction", iter);
          break;
        }
      }
      lambda *= nu;
      nu *= 2;
      if (lambda > 1e16) return done("stalled", iter);
    }
    if (u.some((v, j) => Math.abs(v) > options.divergenceFactor * Math.max(1, typical[j])))
      return done("diverged", iter);
  }
  return done("max-iterations", options.maxIterations);
}

/** Solve [J_F; √λ·D_F] δ_F = [−r; 0] for the free coordinates F; null when QR fails. */
function solveDampedStep(
  J: Matrix,
  r: Float64Array,
  free: number[],
  scale: number[],
  lambda: number,
  p: number,
): number[] | null {
  const n = r.length;
  const m = free.length;
  const A = new Matrix(n + m, m);
  const b = new Matrix(n + m, 1);
  for (let i = 0; i < n; i++) {
    b.set(i, 0, -r[i]);
    for (let k = 0; k < m; k++) A.set(i, k, J.get(i, free[k]));
  }
  const s = Math.sqrt(lambda);
  for (let k = 0; k < m; k++) A.set(n + k, k, s * scale[free[k]]);
  try {
    const x = new QrDecomposition(A).solve(b);
    const delta = new Array<number>(p).fill(0);
    for (let k = 0; k < m; k++) delta[free[k]] = x.get(k, 0);
    return delta.every(Number.isFinite) ? delta : null;
  } catch {
    return null;
  }
}

/** ‖r + J(trial − u)‖², the χ² the linear model predicts at the trial point. */
function linearisedSumSquares(J: Matrix, r: Float64Array, trial: number[], u: number[]): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) {
    let v = r[i];
    for (let j = 0; j < u.length; j++) v += J.get(i, j) * (trial[j] - u[j]);
    s += v * v;
  }
  return s;
}
