/**
 * Instability classes (SCIENCE.md §1) as bit flags so combinations (Turing + Hopf) are one
 * number in a map cell; 0 means stable.
 */
export const CLASS_STABLE = 0;
/** Stable-at-k=0 style diffusion-driven real growth: a local maximum of σ_max at k > 0 with Im σ = 0 and σ > 0. */
export const CLASS_TURING = 1;
/** A complex pair of J with positive real part (oscillation at k = 0). */
export const CLASS_HOPF = 2;
/** A local maximum of σ_max at k > 0 with σ > 0 and Im σ ≠ 0 (needs ≥ 3 species with diagonal D). */
export const CLASS_WAVE = 4;
/** A real eigenvalue of J with positive real part. */
export const CLASS_UNSTABLE_K0 = 8;
/** Map cells only: no admissible steady state. */
export const CLASS_NO_STEADY_STATE = 16;
/** Map cells only: parameters outside their range or the evaluation failed. */
export const CLASS_INVALID = 32;

export type InstabilityClass = "stable" | "turing" | "hopf" | "wave" | "unstable-k0";

const NAMES: [number, InstabilityClass][] = [
  [CLASS_TURING, "turing"], [CLASS_HOPF, "hopf"], [CLASS_WAVE, "wave"], [CLASS_UNSTABLE_K0, "unstable-k0"],
];

/** The class names contained in a flag set (["stable"] for 0). */
export function classNames(flags: number): InstabilityClass[] {
  const out = NAMES.filter(([bit]) => (flags & bit) !== 0).map(([, name]) => name);
  return out.length ? out : ["stable"];
}

/** Human label, e.g. "Turing + Hopf". */
export function classLabel(flags: number): string {
  if (flags & CLASS_NO_STEADY_STATE) return "no steady state";
  if (flags & CLASS_INVALID) return "invalid";
  const labels: Record<InstabilityClass, string> = {
    stable: "stable", turing: "Turing", hopf: "Hopf (k = 0)", wave: "wave (k > 0)", "unstable-k0": "unstable at k = 0",
  };
  return classNames(flags).map((c) => labels[c]).join(" + ");
}

/** Legend of the map codes for JSON output. */
export const CLASS_LEGEND: Record<string, number> = {
  stable: CLASS_STABLE, turing: CLASS_TURING, hopf: CLASS_HOPF, wave: CLASS_WAVE,
  "unstable-k0": CLASS_UNSTABLE_K0, "no-steady-state": CLASS_NO_STEADY_STATE, invalid: CLASS_INVALID,
};
