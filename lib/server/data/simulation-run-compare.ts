/** The one sentence a run page prints: does the simulated wavelength agree with linear theory? */
import { LINEAR_THEORY_TOLERANCE } from "./simulation-run-plan";
import type { RunComparison } from "./simulation-run-types";

const fmt = (v: number) => Number(v.toPrecision(4)).toString();

/**
 * Compares λ_sim ± u with 2π/k* (SCIENCE.md §1). "Within the uncertainty" means within two
 * standard uncertainties (coverage k = 2: common practice, no source); the 20 % band is the
 * tolerance of the solver's own pattern test for a fully developed pattern.
 */
export function compareWithPrediction(simulated: number | null, uncertainty: number | null, predicted: number, unit: string): RunComparison {
  if (simulated === null) {
    return { simulatedWavelength: null, uncertainty: null, predictedWavelength: predicted, relativeDifference: null, withinUncertainty: null, withinLinearTolerance: null, sentence: `The final pattern shows no significant period, so it cannot be compared with the linear prediction 2π/k* = ${fmt(predicted)} ${unit}.` };
  }
  const diff = simulated - predicted;
  const rel = diff / predicted;
  const u = uncertainty ?? 0;
  const withinUncertainty = Math.abs(diff) <= 2 * u;
  const withinLinearTolerance = Math.abs(rel) <= LINEAR_THEORY_TOLERANCE;
  const pct = `${fmt(Math.abs(rel) * 100)} %`;
  const head = `The simulated wavelength ${fmt(simulated)} ± ${fmt(u)} ${unit}`;
  const sentence = withinUncertainty
    ? `${head} agrees with the linear prediction 2π/k* = ${fmt(predicted)} ${unit} within its uncertainty (difference ${pct}).`
    : withinLinearTolerance
      ? `${head} differs from the linear prediction 2π/k* = ${fmt(predicted)} ${unit} by ${pct}, more than two uncertainties but within the ${LINEAR_THEORY_TOLERANCE * 100} % expected of linear theory for a fully developed pattern.`
      : `${head} disagrees with the linear prediction 2π/k* = ${fmt(predicted)} ${unit}: the difference of ${pct} is beyond two uncertainties and beyond the ${LINEAR_THEORY_TOLERANCE * 100} % expected of linear theory.`;
  return { simulatedWavelength: simulated, uncertainty: u, predictedWavelength: predicted, relativeDifference: rel, withinUncertainty, withinLinearTolerance, sentence };
}
