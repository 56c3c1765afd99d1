import { resolveSolverOptions, type ResolvedSolverOptions, type LeastSquaresOptions } from "./resolve-solver-options";
import { jacobianToInternal, type ResidualFunction } from "./jacobian";
import { runLibraryStage } from "./library-stage";
import { createParameterSpace, toInternal, toNatural, typicalScale, type ParameterSpace } from "./parameter-space";
import { polishLevenbergMarquardt, type JacobianProvider, type PolishResult } from "./polish-levenberg-marquardt";
import { drawSeededStarts } from "./seeded-starts";
import { CONVERGED_REASONS, type LeastSquaresProblem, type LocalSolution } from "./types";

/** One start's outcome, for the convergence report. */
export interface StartReport {
  /** The starting point, natural units. */
  start: number[];
  /** `given` is the caller's start, `extra` one of `extraStarts`, `seeded` one of the deterministic random starts. */
  origin: "given" | "extra" | "seeded";
  chiSquare: number;
  converged: boolean;
  reason: LocalSolution["reason"];
  /** Which stages produced this start's answer. */
  stages: "polish" | "library+polish";
}

/** The best local solution over all starts, with every start's report. */
export interface LeastSquaresResult extends LocalSolution {
  /** Weighted residuals at `params`. */
  residuals: Float64Array;
  starts: StartReport[];
  /** Index into `starts` of the answer. */
  bestStart: number;
  /** The validated options, for the statistics stage (bounds, log flags). */
  options: ResolvedSolverOptions;
}

/** The problem's residuals and (optional) Jacobian in solver coordinates. */
export function internalFunctions(
  problem: LeastSquaresProblem,
  space: ParameterSpace,
): { f: ResidualFunction; jacobian?: JacobianProvider } {
  const f: ResidualFunction = (u) => problem.residuals(toNatural(space, u));
  const analytic = problem.jacobian;
  if (!analytic) return { f };
  return {
    f,
    jacobian: (u) => {
      const theta = toNatural(space, u);
      return { jacobian: jacobianToInternal(analytic(theta), theta, space), evaluations: 0 };
    },
  };
}

function atBound(space: ParameterSpace, u: readonly number[]): number[] {
  return u.flatMap((v, j) => (v <= space.lowerU[j] || v >= space.upperU[j] ? [j] : []));
}

/**
 * Weighted nonlinear least squares: minimise χ² = Σ rᵢ(θ)² within bounds, from the given start,
 * any `extraStarts`, and `seededStarts` deterministic random starts. Each start is polished by a bounded
 * Levenberg–Marquardt with QR steps; ml-levenberg-marquardt runs first when `libraryStage` asks
 * for it (by default only as a second attempt when the direct polish does not converge). The
 * answer is the converged start with the lowest χ² (the lowest χ² overall, flagged not converged,
 * when none converged).
 */
export function solveLeastSquares(problem: LeastSquaresProblem, options: LeastSquaresOptions): LeastSquaresResult {
  const checked = resolveSolverOptions(options, problem.parameterCount);
  const space = createParameterSpace(checked.lower, checked.upper, checked.log);
  const u0 = toInternal(space, checked.start);
  const typical = typicalScale(space, u0);
  const { f, jacobian } = internalFunctions(problem, space);
  const explicit = checked.extraStarts.map((s) => toInternal(space, s));
  const startsU = [u0, ...explicit, ...drawSeededStarts(space, u0, typical, checked.seededStarts, checked.seed)];
  const originOf = (k: number): StartReport["origin"] =>
    k === 0 ? "given" : k <= explicit.length ? "extra" : "seeded";
  let evaluations = 0;
  const outcomes = startsU.map((s) => {
    const run = (from: readonly number[]) =>
      polishLevenbergMarquardt(f, from, space, typical, checked.polish, jacobian);
    let best: PolishResult | null = null;
    let libraryIterations = 0;
    let stages: StartReport["stages"] = "polish";
    if (checked.libraryStage !== "always") {
      best = run(s);
      evaluations += best.evaluations;
    }
    const ok = (x: PolishResult | null) => x !== null && CONVERGED_REASONS.includes(x.reason);
    if (checked.libraryStage === "always" || (checked.libraryStage === "fallback" && !ok(best))) {
      const lib = runLibraryStage(f, s, space, typical, checked.library);
      const second = run(lib.u);
      evaluations += lib.evaluations + second.evaluations;
      libraryIterations = lib.iterations;
      const better =
        !best || (ok(second) && !ok(best)) || (ok(second) === ok(best) && second.chiSquare < best.chiSquare);
      if (better) {
        best = second;
        stages = "library+polish";
      }
    }
    return { result: best as PolishResult, libraryIterations, stages };
  });
  const isOk = (o: (typeof outcomes)[number]) => CONVERGED_REASONS.includes(o.result.reason);
  const pool = outcomes.some(isOk) ? outcomes.filter(isOk) : outcomes;
  const winner = pool.reduce((a, b) => (b.result.chiSquare < a.result.chiSquare ? b : a));
  const bestStart = outcomes.indexOf(winner);
  return {
    params: toNatural(space, winner.result.u),
    chiSquare: winner.result.chiSquare,
    converged: isOk(winner),
    reason: winner.result.reason,
    iterations: { library: winner.libraryIterations, polish: winner.result.iterations },
    evaluations,
    atBound: atBound(space, winner.result.u),
    residuals: winner.result.residuals,
    starts: outcomes.map((o, k) => ({
      start: toNatural(space, startsU[k]),
      origin: originOf(k),
      chiSquare: o.result.chiSquare,
      converged: isOk(o),
      reason: o.result.reason,
      stages: o.stages,
    })),
    bestStart,
    options: checked,
  };
}
