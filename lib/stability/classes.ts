/**
 * Instability classes (SCIENCE.md §1). What the analysis finds is kept as bit flags (a growth
 * peak at k > 0, an instability at k = 0, …) so one number describes a map cell; what a person
 * reads is one exclusive class per state, derived from the flags by `classOf`.
 *
 * One definition of Turing everywhere: the steady state is stable at k = 0 (no Hopf, no real
 * growth without diffusion) and diffusion destabilises it at some k > 0 (Murray, Mathematical
 * Biology II, 3rd ed. 2003, ch. 2). A growth peak at k > 0 on top of an instability at k = 0 is a
 * mixed class of its own ("Turing with Hopf", "unstable at k = 0, peak at k > 0"), never Turing.
 */
export const CLASS_STABLE = 0;
/** Bit: a real growth peak at k > 0 (local maximum of σ_max with σ > 0, Im σ = 0). Turing only together with stability at k = 0: see `isTuring`. */
export const CLASS_PEAK = 1;
/** Bit: a complex pair of J with positive real part (oscillation at k = 0). */
export const CLASS_HOPF = 2;
/** Bit: a local maximum of σ_max at k > 0 with σ > 0 and Im σ ≠ 0 (needs ≥ 3 species with diagonal D). */
export const CLASS_WAVE = 4;
/** Bit: a real eigenvalue of J with positive real part. */
export const CLASS_UNSTABLE_K0 = 8;
/** Bit, map cells only: no admissible steady state. */
export const CLASS_NO_STEADY_STATE = 16;
/** Bit, map cells only: parameters outside their range or the evaluation failed. */
export const CLASS_INVALID = 32;

/** The exclusive classes of a steady state (and of a map cell, which adds the last two). */
export type InstabilityClass =
  "stable" | "turing" | "wave" | "hopf" | "turing-hopf" | "unstable-k0" | "peak-unstable-k0";
export type MapClass = InstabilityClass | "no-steady-state" | "invalid";

/** Every map class in legend order, with the words a page shows. */
export const MAP_CLASSES: readonly { name: MapClass; label: string }[] = [
  { name: "turing", label: "Turing" },
  { name: "turing-hopf", label: "Turing with Hopf (k = 0)" },
  { name: "peak-unstable-k0", label: "unstable at k = 0, peak at k > 0" },
  { name: "wave", label: "wave (k > 0)" },
  { name: "hopf", label: "Hopf (k = 0)" },
  { name: "unstable-k0", label: "unstable at k = 0" },
  { name: "stable", label: "stable" },
  { name: "no-steady-state", label: "no steady state" },
  { name: "invalid", label: "invalid" },
];
const LABELS = Object.fromEntries(MAP_CLASSES.map((c) => [c.name, c.label])) as Record<MapClass, string>;

/** True when the state is stable without diffusion (no Hopf, no real growth at k = 0). */
export function isStableAtZero(flags: number): boolean {
  return (flags & (CLASS_HOPF | CLASS_UNSTABLE_K0)) === 0;
}

/** The one definition: stable at k = 0, a real growth peak at some k > 0, and a valid state. */
export function isTuring(flags: number): boolean {
  return (
    (flags & CLASS_PEAK) !== 0 &&
    (flags & (CLASS_HOPF | CLASS_UNSTABLE_K0 | CLASS_NO_STEADY_STATE | CLASS_INVALID)) === 0
  );
}

/** The exclusive class of a flag set; every flag set has exactly one. */
export function classOf(flags: number): MapClass {
  if (flags & CLASS_NO_STEADY_STATE) return "no-steady-state";
  if (flags & CLASS_INVALID) return "invalid";
  if (flags & CLASS_UNSTABLE_K0) return flags & (CLASS_PEAK | CLASS_WAVE) ? "peak-unstable-k0" : "unstable-k0";
  if (flags & CLASS_HOPF) return flags & CLASS_PEAK ? "turing-hopf" : "hopf";
  if (flags & CLASS_PEAK) return "turing";
  if (flags & CLASS_WAVE) return "wave";
  return "stable";
}

/** The class of a steady state's flags as a one-element list (kept a list for the API's `classes`). */
export function classNames(flags: number): InstabilityClass[] {
  return [classOf(flags) as InstabilityClass];
}

/** Human label of the exclusive class, e.g. "Turing with Hopf (k = 0)". */
export function classLabel(flags: number): string {
  return LABELS[classOf(flags)];
}

/** Map codes of the flag bits for JSON output (bits combine; `classOf` names the combination). */
export const CLASS_LEGEND: Record<string, number> = {
  stable: CLASS_STABLE,
  peak: CLASS_PEAK,
  hopf: CLASS_HOPF,
  wave: CLASS_WAVE,
  "unstable-k0": CLASS_UNSTABLE_K0,
  "no-steady-state": CLASS_NO_STEADY_STATE,
  invalid: CLASS_INVALID,
};
