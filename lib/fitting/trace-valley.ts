import { fitWithFixed, type SolverContext } from "./fit-with-fixed";

/** A point of the curve of equally good solutions. */
export interface ValleyPoint {
  /** All parameters, natural units. */
  params: number[];
  /** χ² above the fit's minimum. */
  deltaChiSquare: number;
  /** Δχ² ≤ the interval threshold: statistically as good as the fit. */
  withinConfidence: boolean;
}

/** The valley: for a grid of one parameter, the other parameters re-optimised. */
export interface Valley {
  /** Index of the parameter stepped along the grid. */
  parameterIndex: number;
  points: ValleyPoint[];
}

/**
 * Trace the solution set of a non-identifiable fit: `count` grid values of coordinate `j` between
 * `fromU` and `toU` (solver coordinates, so log-scaled parameters get a geometric grid), each with
 * the other parameters re-optimised. The grid is walked outwards from the estimate so each point
 * starts from its neighbour's solution and stays on the same branch of the valley.
 */
export function traceValley(
  ctx: SolverContext,
  uHat: readonly number[],
  chiMin: number,
  j: number,
  fromU: number,
  toU: number,
  count: number,
  delta: number,
  toNaturalValues: (u: number[]) => number[],
): Valley {
  const grid = Array.from({ length: count }, (_, k) => fromU + ((toU - fromU) * k) / (count - 1));
  const results = new Array<ValleyPoint | null>(count).fill(null);
  const centre = grid.reduce((best, v, k) => (Math.abs(v - uHat[j]) < Math.abs(grid[best] - uHat[j]) ? k : best), 0);
  const walk = (indices: number[]) => {
    let warm = uHat.slice();
    for (const k of indices) {
      const fit = fitWithFixed(ctx, j, grid[k], warm);
      const d = fit.chiSquare - chiMin;
      results[k] = { params: toNaturalValues(fit.u), deltaChiSquare: d, withinConfidence: d <= delta };
      if (Number.isFinite(fit.chiSquare)) warm = fit.u;
    }
  };
  walk(Array.from({ length: count - centre }, (_, i) => centre + i));
  walk(Array.from({ length: centre }, (_, i) => centre - 1 - i));
  return { parameterIndex: j, points: results as ValleyPoint[] };
}
