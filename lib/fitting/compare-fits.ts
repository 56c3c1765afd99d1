import { FitError } from "./errors";
import { computeAkaikeWeights } from "./information-criteria";
import type { WavelengthFitResult, WavelengthVerdict } from "./wavelength-result";

/** A fit to compare, under a label (e.g. the kinetics' name). */
export interface LabelledFit {
  label: string;
  result: WavelengthFitResult;
}

export interface RankedFit {
  rank: number;
  label: string;
  aicc: number | null;
  /** AICc − best AICc; null when AICc is undefined (n − p − 1 ≤ 0). */
  deltaAicc: number | null;
  /** Relative support within this set; null when AICc is undefined. */
  akaikeWeight: number | null;
  bic: number;
  chiSquare: number;
  p: number;
  verdict: WavelengthVerdict;
  identifiable: boolean;
}

export interface FitComparison {
  criterion: "AICc";
  ranking: RankedFit[];
  notes: string[];
}

/**
 * Rank fits of different models to the same measurements by AICc, with Akaike weights
 * wᵢ = exp(−Δᵢ/2)/Σ exp(−Δⱼ/2) (Burnham & Anderson 2002, §2.9). Fits whose AICc is undefined
 * (too few measurements for their parameters) are listed last without a weight.
 * @throws FitError when the list is empty, labels repeat, or the fits used different data.
 */
export function compareFits(fits: readonly LabelledFit[]): FitComparison {
  if (!Array.isArray(fits) || fits.length === 0)
    throw new FitError("bad_option", "fits must hold at least one fit; got none.", "fits");
  const seen = new Set<string>();
  fits.forEach((f, i) => {
    if (seen.has(f.label))
      throw new FitError(
        "bad_option",
        `fits[${i}].label "${f.label}" is used twice; labels must be unique.`,
        `fits[${i}].label`,
      );
    seen.add(f.label);
    if (f.result.dataFingerprint !== fits[0].result.dataFingerprint)
      throw new FitError(
        "bad_option",
        `fits[${i}] ("${f.label}") was fitted to different measurements than fits[0] ("${fits[0].label}"); models can only be compared on the same data.`,
        `fits[${i}]`,
      );
  });
  const weights = computeAkaikeWeights(fits.map((f) => f.result.aicc));
  const finite = fits.map((f) => f.result.aicc).filter((a): a is number => a !== null);
  const best = finite.length > 0 ? Math.min(...finite) : null;
  const rows = fits.map((f, i) => ({
    label: f.label,
    aicc: f.result.aicc,
    deltaAicc: f.result.aicc !== null && best !== null ? f.result.aicc - best : null,
    akaikeWeight: weights[i],
    bic: f.result.bic,
    chiSquare: f.result.chiSquare,
    p: f.result.p,
    verdict: f.result.verdict,
    identifiable: f.result.identifiability.identifiable,
  }));
  rows.sort((a, b) => (a.aicc === null ? 1 : 0) - (b.aicc === null ? 1 : 0) || (a.aicc ?? a.bic) - (b.aicc ?? b.bic));
  const notes: string[] = [];
  const undefinedAicc = rows.filter((r) => r.aicc === null).map((r) => `"${r.label}"`);
  if (undefinedAicc.length > 0)
    notes.push(
      `AICc is undefined for ${undefinedAicc.join(", ")} (n − p − 1 ≤ 0: too few measurements for the parameters); listed last, by BIC.`,
    );
  const notFitting = rows.filter((r) => r.verdict !== "fits").map((r) => `"${r.label}"`);
  if (notFitting.length > 0)
    notes.push(
      `${notFitting.join(", ")} do not fit within the Turing region; their rank says how close they come, not that they explain the data.`,
    );
  return { criterion: "AICc", ranking: rows.map((r, k) => ({ rank: k + 1, ...r })), notes };
}
