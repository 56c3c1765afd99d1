import type { ResolvedWavelengthSpec } from "./resolve-wavelength-spec";
import type { BoxSample } from "./sample-turing-box";
import { solveLeastSquares, type LeastSquaresResult } from "./solve-least-squares";
import type { WavelengthModel } from "./wavelength-model";
import type { FittedDatum, WavelengthFitResult, WavelengthVerdict } from "./wavelength-result";

const fmt = (v: number) => Number(v.toPrecision(3)).toString();
const maxAbs = (r: ArrayLike<number>) => Array.from(r).reduce((m, x) => Math.max(m, Math.abs(x)), 0);

export interface Judgement {
  verdict: WavelengthVerdict;
  reason: string;
  outsideTuring: WavelengthFitResult["outsideTuring"];
  warnings: string[];
}

/**
 * The verdict (a design choice): the fit "fits" when every measurement is within `reachSigma`
 * uncertainties of a Turing-unstable prediction. Otherwise a second fit that accepts any finite
 * prediction (Turing or not) is run from the Turing fit and the best box samples; if it reaches
 * the data with a non-Turing state the verdict is "fits only outside the Turing region",
 * else "cannot reach the measured wavelength".
 */
export function judgeFit<T>(
  spec: ResolvedWavelengthSpec<T>,
  model: WavelengthModel,
  solution: LeastSquaresResult,
  residuals: FittedDatum[],
  samples: BoxSample[],
  record: (free: readonly number[]) => Record<string, number>,
): Judgement {
  const reach = spec.options.reachSigma;
  const worstTuring = maxAbs(solution.residuals);
  if (worstTuring <= reach) {
    return {
      verdict: "fits",
      reason: `Every measurement is within ${fmt(reach)} uncertainties of a Turing-unstable prediction (largest |residual| ${fmt(worstTuring)}).`,
      outsideTuring: null,
      warnings: [],
    };
  }
  const worst = residuals.reduce((a, b) => (Math.abs(b.residual ?? 0) > Math.abs(a.residual ?? 0) ? b : a));
  const miss = `the best Turing-unstable fit misses by up to ${fmt(worstTuring)} uncertainties (condition "${worst.condition}": predicted ${fmt(worst.predictedUm ?? NaN)} µm, measured ${fmt(worst.measuredFourierUm)} µm as a Fourier wavelength)`;
  const anyProblem = model.problem("any");
  const starts = samples
    .filter((s) => Number.isFinite(s.chiSquareAny))
    .sort((a, b) => a.chiSquareAny - b.chiSquareAny)
    .slice(0, spec.options.seededStarts + 1)
    .map((s) => s.free);
  const bounds = {
    lower: spec.slots.map((s) => s.lower),
    upper: spec.slots.map((s) => s.upper),
    log: spec.slots.map((s) => s.log),
  };
  const any = solveLeastSquares(anyProblem, { start: solution.params, extraStarts: starts, ...bounds });
  const preds = model.predict(any.params);
  const nonTuring = [...new Set(spec.data.flatMap((d, i) => (preds[i] && !preds[i]!.turing ? [d.condition] : [])))];
  const worstAny = maxAbs(any.residuals);
  const outsideTuring = {
    params: record(any.params),
    chiSquare: any.chiSquare,
    maxAbsResidual: worstAny,
    nonTuringConditions: nonTuring,
  };
  const warnings: string[] = [];
  if (nonTuring.length === 0 && any.chiSquare < solution.chiSquare * (1 - 1e-6))
    warnings.push(
      `A better Turing-unstable fit (χ² ${fmt(any.chiSquare)} < ${fmt(solution.chiSquare)}) was found by the second search: the reported fit is a local minimum; increase options.seededStarts.`,
    );
  if (Number.isFinite(worstAny) && worstAny <= reach && nonTuring.length > 0) {
    return {
      verdict: "fits only outside the Turing region",
      reason: `No Turing-unstable state within the bounds reaches the measurements: ${miss}. A state outside the Turing region (conditions ${nonTuring.map((c) => `"${c}"`).join(", ")}) reaches them within ${fmt(worstAny)} uncertainties, but a pattern there would not arise by a Turing instability.`,
      outsideTuring,
      warnings,
    };
  }
  return {
    verdict: "cannot reach the measured wavelength",
    reason: `No state within the bounds reaches the measurements: ${miss}.`,
    outsideTuring,
    warnings,
  };
}
