import { levenbergMarquardt } from "ml-levenberg-marquardt";
import type { ResidualFunction } from "./jacobian";
import type { ParameterSpace } from "./parameter-space";

/** Options handed to ml-levenberg-marquardt (v5) for the first, coarse stage. */
export interface LibraryStageOptions {
  /** Iterations of the library (it has no convergence test of its own for χ² > 0). @default 40 */
  maxIterations: number;
  /** The library's absolute damping; applied in rescaled coordinates where every u/typical ≈ 1. @default 1e-2 */
  damping: number;
  /** Finite-difference step in rescaled coordinates (central differences). @default 1e-6 */
  gradientDifference: number;
}

export const DEFAULT_LIBRARY_STAGE: LibraryStageOptions = {
  maxIterations: 40,
  damping: 1e-2,
  gradientDifference: 1e-6,
};

/**
 * Run ml-levenberg-marquardt on the weighted residuals. The library fits y ≈ f(x); here x is the
 * residual index, y = 0 and f(i) = rᵢ(u), with weights 1 — its own weighting is not used because
 * v5 applies the weights inconsistently between χ² (× w²) and the step (× 1/w²). The coordinates
 * are rescaled by their typical magnitude so the library's absolute damping and
 * finite-difference step mean the same thing for every parameter. It needs at least two data
 * points, so a one-residual problem gets a constant zero residual appended (χ² unchanged).
 * Returns the best point the library visited (it keeps track of it itself), or the start and the
 * library's message when it threw.
 */
export function runLibraryStage(
  f: ResidualFunction,
  u0: readonly number[],
  space: ParameterSpace,
  typical: readonly number[],
  options: LibraryStageOptions = DEFAULT_LIBRARY_STAGE,
): { u: number[]; iterations: number; evaluations: number; error?: string } {
  const n = f(u0).length;
  const m = Math.max(n, 2);
  let evaluations = 1;
  const x = Array.from({ length: m }, (_, i) => i);
  const y = new Array<number>(m).fill(0);
  const model = (v: number[]) => {
    const r = f(v.map((vj, j) => vj * typical[j]));
    evaluations++;
    return (i: number) => (i < n ? r[i] : 0);
  };
  let result: { parameterValues: number[]; iterations: number };
  try {
    result = levenbergMarquardt({ x, y }, model, {
      initialValues: u0.map((v, j) => v / typical[j]),
      minValues: space.lowerU.map((v, j) => v / typical[j]),
      maxValues: space.upperU.map((v, j) => v / typical[j]),
      damping: options.damping,
      gradientDifference: options.gradientDifference,
      centralDifference: true,
      maxIterations: options.maxIterations,
      errorTolerance: 0,
    });
  } catch (err) {
    // v5 throws from its Cholesky step when the approximate Hessian has gone non-finite.
    return { u: u0.slice(), iterations: 0, evaluations, error: err instanceof Error ? err.message : String(err) };
  }
  return { u: result.parameterValues.map((v, j) => v * typical[j]), iterations: result.iterations, evaluations };
}
