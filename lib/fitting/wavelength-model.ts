import { valuesForCondition, type ResolvedWavelengthSpec } from "./resolve-wavelength-spec";
import type { LeastSquaresProblem } from "./types";
import type { WavelengthPrediction, WavelengthPredictor } from "./wavelength-spec";

/** `turing`: only Turing-unstable predictions count (others are inadmissible); `any`: every finite prediction counts. */
export type PredictionMode = "turing" | "any";

/** The predictor wrapped for fitting: one call per distinct (condition, domain), errors counted, not thrown. */
export interface WavelengthModel {
  /** Predictions for each datum at the free coordinates (null: none). */
  predict(free: readonly number[]): (WavelengthPrediction | null)[];
  /** Least-squares problem over the free coordinates; inadmissible predictions give NaN residuals. */
  problem(mode: PredictionMode): LeastSquaresProblem;
  /** Weighted residuals from given predictions. */
  residualsOf(predictions: readonly (WavelengthPrediction | null)[], mode: PredictionMode): Float64Array;
  /** Predictor calls that threw, with the first message. */
  failures(): { count: number; firstMessage: string | null };
}

export function createWavelengthModel<TDomain>(
  spec: ResolvedWavelengthSpec<TDomain>,
  predictor: WavelengthPredictor<TDomain>,
): WavelengthModel {
  const keyOf = (i: number) => `${spec.data[i].condition}\u0000${JSON.stringify(spec.data[i].domain ?? null)}`;
  const keys = [...new Set(spec.data.map((_, i) => keyOf(i)))];
  const first = keys.map((k) => spec.data.findIndex((_, i) => keyOf(i) === k));
  const datumKey = spec.data.map((_, i) => keys.indexOf(keyOf(i)));
  let failureCount = 0;
  let firstMessage: string | null = null;
  let cacheKey = "";
  let cacheValue: (WavelengthPrediction | null)[] = [];

  const callOnce = (free: readonly number[], k: number): WavelengthPrediction | null => {
    const d = spec.data[first[k]];
    try {
      const p = predictor(valuesForCondition(spec, free, d.condition), d.condition, d.domain);
      if (!p || !(p.wavelengthUm > 0) || !Number.isFinite(p.wavelengthUm)) return null;
      return { wavelengthUm: p.wavelengthUm, turing: p.turing === true };
    } catch (err) {
      failureCount++;
      firstMessage ??= err instanceof Error ? err.message : String(err);
      return null;
    }
  };
  const predict = (free: readonly number[]) => {
    const key = free.join(",");
    if (key !== cacheKey) {
      const perKey = keys.map((_, k) => callOnce(free, k));
      cacheValue = datumKey.map((k) => perKey[k]);
      cacheKey = key;
    }
    return cacheValue;
  };
  const residualsOf = (predictions: readonly (WavelengthPrediction | null)[], mode: PredictionMode) =>
    Float64Array.from(spec.data, (d, i) => {
      const p = predictions[i];
      if (!p || (mode === "turing" && !p.turing)) return NaN;
      return (p.wavelengthUm - d.fourierUm) / d.fourierUncertaintyUm;
    });
  return {
    predict,
    residualsOf,
    problem: (mode) => ({
      residualCount: spec.data.length,
      parameterCount: spec.slots.length,
      residuals: (free) => residualsOf(predict(free), mode),
    }),
    failures: () => ({ count: failureCount, firstMessage }),
  };
}
