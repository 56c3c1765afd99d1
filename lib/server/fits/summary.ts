/**
 * What a list shows of a fit, from its stored spec, provenance and (once it succeeded) result:
 * one function for the summary stored beside the fit (Fit.summary, written at its creation and
 * again with its result) and for fits made before that column.
 */
import "server-only";
import type { StoredFitResult } from "./result";
import type { FitProvenance, StoredFitSpec } from "./spec-types";

export interface FitSummary {
  /** The kinetics' labels, in the order of the spec. */
  kinetics: string[];
  /** The conditions of the data, each once, in the order they first appear. */
  conditions: string[];
  /** Data points. */
  n: number;
  /** The best-ranked kinetics (the only one of a single fit); null before a result. */
  best: string | null;
  /** Its verdict; null before a result. */
  verdict: string | null;
}

export function fitSummaryOf(
  spec: StoredFitSpec,
  provenance: FitProvenance,
  result: StoredFitResult | null,
): FitSummary {
  const best = result ? (result.comparison?.ranking[0]?.label ?? result.models[0]?.label ?? null) : null;
  return {
    kinetics: provenance.kinetics.map((k) => k.label),
    conditions: [...new Set(spec.data.map((d) => d.condition))],
    n: spec.data.length,
    best,
    verdict: result?.models.find((x) => x.label === best)?.fit.verdict ?? null,
  };
}
