/**
 * What a finished fit stores in its `result` column: per kinetics the fitting core's result (as
 * `cli fit --json` prints it) and the predictions at the best fit; for several kinetics the AICc
 * ranking. Types only plus one pure helper, so pages may import them.
 */
import "server-only";
import type { FitComparison, WavelengthFitResult } from "@/lib/fitting";
import type { ConditionPrediction } from "./predictions";
import type { FitKineticsSource } from "./spec-types";

export interface FittedModelResult {
  label: string;
  kinetics: FitKineticsSource;
  fit: WavelengthFitResult;
  predictions: ConditionPrediction[];
  /** Wall-clock time of this model's fit, ms. */
  elapsedMs: number;
}

export interface StoredFitResult {
  models: FittedModelResult[];
  /** Ranking by AICc with Akaike weights; null for a one-kinetics fit. */
  comparison: FitComparison | null;
  runner: "child-process" | "in-process";
  elapsedMs: number;
}

/** The numbers a re-run must reproduce: parameters, χ², criteria, residuals (timings left out). */
export function numbersOf(r: StoredFitResult): unknown {
  return r.models.map((m) => ({
    label: m.label,
    parameters: m.fit.parameters.map((p) => [
      p.name,
      p.value,
      p.standardError,
      p.interval95?.lower.value ?? null,
      p.interval95?.upper.value ?? null,
    ]),
    chiSquare: m.fit.chiSquare,
    aicc: m.fit.aicc,
    bic: m.fit.bic,
    verdict: m.fit.verdict,
    residuals: m.fit.residuals.map((x) => x.residual),
  }));
}
