/** The sentences a run page prints: does the simulated wavelength agree with linear theory, and with the measurement? */
import "server-only";
import { LINEAR_THEORY_TOLERANCE } from "./plan";
import type { RunComparison } from "./types";

const fmt = (v: number) => Number(v.toPrecision(4)).toString();

export interface CompareOptions {
  /** What the reference is, in words. @default "the linear prediction 2π/k* = …" */
  what?: string;
  /** Standard uncertainty of the reference (a measured mean's SE); combined in quadrature. @default 0 (a prediction) */
  referenceUncertainty?: number;
}

/**
 * Compares λ_sim ± u with a reference: the prediction 2π/k* (SCIENCE.md §1) or a measured mean.
 * "Within the uncertainty" means within two combined standard uncertainties, 2·√(u² + u_ref²)
 * (coverage k = 2: common practice, no source); for a prediction, the 20 % band is the tolerance
 * of the solver's own pattern test for a fully developed pattern.
 */
export function compareWithPrediction(
  simulated: number | null,
  uncertainty: number | null,
  reference: number,
  unit: string,
  options: CompareOptions = {},
): RunComparison {
  const prediction = options.what === undefined;
  const what = prediction
    ? `the linear prediction 2π/k* = ${fmt(reference)} ${unit}`
    : `${options.what}, ${fmt(reference)} ± ${fmt(options.referenceUncertainty ?? 0)} ${unit}`;
  if (simulated === null) {
    return {
      simulatedWavelength: null,
      uncertainty: null,
      predictedWavelength: reference,
      relativeDifference: null,
      withinUncertainty: null,
      withinLinearTolerance: null,
      sentence: `The final pattern shows no significant period, so it cannot be compared with ${what}.`,
    };
  }
  const diff = simulated - reference;
  const rel = diff / reference;
  const u = uncertainty ?? 0;
  const combined = Math.hypot(u, options.referenceUncertainty ?? 0);
  const withinUncertainty = Math.abs(diff) <= 2 * combined;
  const withinLinearTolerance = prediction ? Math.abs(rel) <= LINEAR_THEORY_TOLERANCE : null;
  const pct = `${fmt(Math.abs(rel) * 100)} %`;
  const head = `The simulated wavelength ${fmt(simulated)} ± ${fmt(u)} ${unit}`;
  const sentence = withinUncertainty
    ? `${head} agrees with ${what} within the uncertainty (difference ${pct}).`
    : withinLinearTolerance
      ? `${head} differs from ${what} by ${pct}, more than two uncertainties but within the ${LINEAR_THEORY_TOLERANCE * 100} % expected of linear theory for a fully developed pattern.`
      : prediction
        ? `${head} disagrees with ${what}: the difference of ${pct} is beyond two uncertainties and beyond the ${LINEAR_THEORY_TOLERANCE * 100} % expected of linear theory.`
        : `${head} disagrees with ${what}: the difference of ${pct} is beyond two combined uncertainties.`;
  return {
    simulatedWavelength: simulated,
    uncertainty: u,
    predictedWavelength: reference,
    relativeDifference: rel,
    withinUncertainty,
    withinLinearTolerance,
    sentence,
  };
}
