/**
 * What a fitted model predicts at its best fit, per condition: the parameter values, the
 * dispersion relation (for the plot), the predicted Fourier wavelength 2π/k* against the measured
 * mean, the expected repeats on each tissue size given with the data, and the elasticities
 * ∂ln λ* / ∂ln p. Cheap (a few dozen dispersion relations), so it runs in the job after the fit.
 */
import "server-only";
import type { WavelengthFitResult } from "@/lib/fitting";
import { SCALE_PARAMETERS } from "@/lib/fitting/kinetics-predictor";
import { computeDispersion, computeElasticities, type DomainSpec } from "@/lib/stability";
import { compileStoredModel } from "./model-run";
import type { StoredFitModel, StoredFitSpec } from "./spec-types";

export interface ConditionPrediction {
  condition: string;
  /** Every parameter at the fit (fixed and fitted), by name; scales included when fitted. */
  parameters: Record<string, number>;
  lengthScaleUm: number | null;
  timeScaleS: number | null;
  classification: string;
  /** 2π/k* on the unbounded domain, µm. */
  predictedUm: number | null;
  /** Measured Fourier-scale wavelengths of this condition, µm (weighted mean ± its SE). */
  measuredMeanUm: number;
  measuredSeUm: number;
  n: number;
  /** The curve in model units, for the dispersion plot. */
  curve: { k: number[]; sigma: number[]; imSigma: number[] };
  bands: { kLow: number; kHigh: number }[];
  kStar: number | null;
  /** Per tissue size given with this condition's data: the fastest admissible mode and its repeats. */
  tissues: {
    domain: DomainSpec;
    wavelengthUm: number | null;
    patterningExpected: boolean;
    repeats: Record<string, number>;
  }[];
  elasticities: { name: string; elasticity: number }[];
  elasticityNote: string | null;
}

/** Best-fit values a condition sees: fixed values, then free and per-condition ones. */
export function valuesAtFit(
  model: StoredFitModel,
  fit: WavelengthFitResult,
  condition: string,
): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, s] of Object.entries(model.parameters))
    if (s.mode === "fixed") out[name] = typeof s.value === "number" ? s.value : s.value[condition];
  for (const p of fit.parameters) if (p.condition === null || p.condition === condition) out[p.parameter] = p.value;
  return out;
}

export function predictAtFit(
  spec: StoredFitSpec,
  model: StoredFitModel,
  fit: WavelengthFitResult,
): ConditionPrediction[] {
  const kinetics = compileStoredModel(model);
  const conditions = [...new Set(spec.data.map((d) => d.condition))];
  return conditions.map((condition) => {
    const all = valuesAtFit(model, fit, condition);
    const params: Record<string, number> = {};
    for (const [k, v] of Object.entries(all)) if (!(SCALE_PARAMETERS as readonly string[]).includes(k)) params[k] = v;
    const scales = {
      lengthScaleUm: all.lengthScaleUm ?? model.lengthScaleUm,
      timeScaleS: all.timeScaleS ?? model.timeScaleS,
      gridSize: model.gridSize,
    };
    const mine = fit.residuals.filter((r) => r.condition === condition);
    const w = mine.map((r) => 1 / r.uncertaintyFourierUm ** 2);
    const sw = w.reduce((a, b) => a + b, 0);
    const measuredMeanUm = mine.reduce((a, r, i) => a + w[i] * r.measuredFourierUm, 0) / sw;
    const base = {
      condition,
      parameters: all,
      lengthScaleUm: scales.lengthScaleUm ?? null,
      timeScaleS: scales.timeScaleS ?? null,
      measuredMeanUm,
      measuredSeUm: 1 / Math.sqrt(sw),
      n: mine.length,
    };
    let r;
    try {
      r = computeDispersion(kinetics, params, scales);
    } catch (err) {
      return {
        ...base,
        classification: `no prediction: ${(err as Error).message}`,
        predictedUm: null,
        curve: { k: [], sigma: [], imSigma: [] },
        bands: [],
        kStar: null,
        tissues: [],
        elasticities: [],
        elasticityNote: null,
      };
    }
    const domains = [
      ...new Map(
        spec.data
          .filter((d) => d.condition === condition && d.domain)
          .map((d) => [JSON.stringify(d.domain), d.domain!]),
      ).values(),
    ];
    const tissues = domains.map((domain) => {
      const t = computeDispersion(kinetics, params, { ...scales, domain }).domain!;
      return {
        domain,
        wavelengthUm: t.fastestMode.wavelengthUm,
        patterningExpected: t.patterningExpected,
        repeats: t.fastestMode.repeats,
      };
    });
    let elasticities: ConditionPrediction["elasticities"] = [];
    let elasticityNote: string | null = null;
    try {
      const e = computeElasticities(kinetics, params, scales);
      elasticities = e.elasticities.flatMap((x) =>
        x.elasticity === null ? [] : [{ name: x.name, elasticity: x.elasticity }],
      );
      const skipped = e.elasticities.filter((x) => x.elasticity === null).map((x) => `${x.name} (${x.reason})`);
      if (skipped.length) elasticityNote = `Not computed for ${skipped.join("; ")}.`;
    } catch (err) {
      elasticityNote = (err as Error).message;
    }
    return {
      ...base,
      classification: r.classification.label,
      predictedUm: r.fastest?.wavelengthUm ?? null,
      curve: r.curve,
      bands: r.bands.map((b) => ({ kLow: b.kLow, kHigh: b.kHigh })),
      kStar: r.fastest?.kStar ?? null,
      tissues,
      elasticities,
      elasticityNote,
    };
  });
}
