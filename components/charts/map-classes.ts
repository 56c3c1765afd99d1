/**
 * Colours of the exclusive map classes (lib/stability/classes.ts), shared by the kinetics page's
 * heat map and the fit's map. Turing cells are shaded by wavelength in the model-prediction
 * violet; the mixed classes keep a hint of violet on a warning tone, so they never read as Turing.
 */
import { classOf, type MapClass } from "@/lib/stability/classes";

export const MAP_CLASS_COLOUR: Record<Exclude<MapClass, "turing">, string> = {
  "turing-hopf": "#cdb9d6",
  "peak-unstable-k0": "#e8c3c9",
  wave: "#b9dcd0",
  hopf: "#c8d5e6",
  "unstable-k0": "#f6dcd6",
  stable: "#ece4d3",
  "no-steady-state": "#9e978a",
  invalid: "#ffffff",
};

/** Violet ramp from #e9e1f4 (t = 0, short λ) to #3d2466 (t = 1, long λ). */
export function turingShade(t: number): string {
  const a = [233, 225, 244],
    b = [61, 36, 102];
  const c = a.map((v, i) => Math.round(v + (b[i] - v) * t));
  return `rgb(${c[0]},${c[1]},${c[2]})`;
}

/** Fill of one cell: Turing cells by their wavelength's place in [lo, hi], the rest by class. */
export function cellFill(flags: number, wavelength: number | null, lo: number, hi: number): string {
  const c = classOf(flags);
  if (c === "turing")
    return wavelength === null ? turingShade(0.5) : turingShade(hi > lo ? (wavelength - lo) / (hi - lo) : 0.5);
  return MAP_CLASS_COLOUR[c];
}
