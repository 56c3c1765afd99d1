import { analyseFit, type AnalysisOptions, type FitAnalysis } from "./analyse-fit";
import type { LeastSquaresOptions } from "./resolve-solver-options";
import { FitError } from "./errors";
import { solveLeastSquares, type LeastSquaresResult } from "./solve-least-squares";
import type { LeastSquaresProblem } from "./types";

/** Measurements yᵢ at xᵢ with optional standard deviations sᵢ (default 1: unweighted). */
export interface CurveData {
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  sigma?: ArrayLike<number>;
}

/** A model y = f(θ, x) and, optionally, its gradient ∂f/∂θ at x. */
export interface CurveModel {
  value: (params: readonly number[], x: number) => number;
  gradient?: (params: readonly number[], x: number) => number[];
}

export interface CurveFit {
  solution: LeastSquaresResult;
  analysis: FitAnalysis;
}

/** Check the data once and turn them into weighted residuals rᵢ = (f(θ, xᵢ) − yᵢ)/sᵢ. */
export function createCurveProblem(data: CurveData, model: CurveModel, parameterCount: number): LeastSquaresProblem {
  const n = data.y.length;
  if (n === 0) throw new FitError("bad_data", "data.y must hold at least one measurement; got none.", "data.y");
  if (data.x.length !== n)
    throw new FitError(
      "bad_data",
      `data.x must hold ${n} values (one per measurement); got ${data.x.length}.`,
      "data.x",
    );
  const sigma = data.sigma ? Array.from(data.sigma) : new Array<number>(n).fill(1);
  if (sigma.length !== n)
    throw new FitError(
      "bad_data",
      `data.sigma must hold ${n} values (one per measurement); got ${sigma.length}.`,
      "data.sigma",
    );
  sigma.forEach((s, i) => {
    if (!(s > 0) || !Number.isFinite(s))
      throw new FitError(
        "bad_data",
        `data.sigma[${i}] must be a positive finite number; got ${s}.`,
        `data.sigma[${i}]`,
      );
  });
  const x = Array.from(data.x);
  const y = Array.from(data.y);
  const gradient = model.gradient;
  return {
    residualCount: n,
    parameterCount,
    residuals: (params) => Float64Array.from(x, (xi, i) => (model.value(params, xi) - y[i]) / sigma[i]),
    jacobian: gradient ? (params) => x.map((xi, i) => gradient(params, xi).map((g) => g / sigma[i])) : undefined,
  };
}

/**
 * Fit y = f(θ, x) to data by weighted least squares and analyse the result: a convenience over
 * {@link solveLeastSquares} + {@link analyseFit} for ordinary curve data.
 */
export function fitCurve(data: CurveData, model: CurveModel, options: LeastSquaresOptions & AnalysisOptions): CurveFit {
  const problem = createCurveProblem(data, model, options.start.length);
  const solution = solveLeastSquares(problem, options);
  return { solution, analysis: analyseFit(problem, solution, options) };
}
