import type { FieldArray } from "./reaction-system";

/** Summary of one species' field. */
export interface FieldStats {
  min: number;
  max: number;
  mean: number;
}

/** Min, max and mean of a field (mean = total mass / cell count on a uniform grid). */
export function computeFieldStats(field: FieldArray): FieldStats {
  let min = Infinity,
    max = -Infinity,
    sum = 0;
  for (let i = 0; i < field.length; i++) {
    const v = field[i];
    if (v < min) min = v;
    if (v > max) max = v;
    sum += v;
  }
  return { min, max, mean: sum / field.length };
}

/** Largest |value| over all fields; NaN when any value is NaN or infinite. */
export function computeMaxAbs(fields: readonly FieldArray[]): number {
  let m = 0,
    sum = 0;
  for (const f of fields) {
    for (let i = 0; i < f.length; i++) {
      const v = f[i];
      sum += v; // NaN or ±Infinity anywhere makes the sum non-finite
      const a = v < 0 ? -v : v;
      if (a > m) m = a;
    }
  }
  return Number.isFinite(sum) ? m : NaN;
}

/**
 * Relative L2 change per unit time between two states of all species:
 * ‖c − c_ref‖₂ / (‖c‖₂ · Δt), in 1/s. Returns Infinity when ‖c‖₂ = 0 and the states differ.
 */
export function computeRelativeChangeRate(
  fields: readonly FieldArray[],
  reference: readonly FieldArray[],
  intervalS: number,
): number {
  let diff = 0,
    norm = 0;
  for (let s = 0; s < fields.length; s++) {
    const f = fields[s],
      r = reference[s];
    for (let i = 0; i < f.length; i++) {
      const d = f[i] - r[i];
      diff += d * d;
      norm += f[i] * f[i];
    }
  }
  if (diff === 0) return 0;
  return norm === 0 ? Infinity : Math.sqrt(diff / norm) / intervalS;
}
