import type { SpectralBasis } from "./cosine-basis";
import { computeMaxAbs } from "./field-stats";
import type { SpeciesCoefficients } from "./schemes";

/**
 * What the spectral stage of one step does (see schemes.ts):
 * - FirstOrder: work holds c + hR; work ← inverse(m · forward(work)).
 * - EtdStart: work holds R⁰; ĉ ← e ĉ + p1 R̂; R̂prev ← R̂; work ← inverse(ĉ).
 * - Etd2: work holds Rⁿ; ĉ ← e ĉ + a R̂ + b R̂prev; R̂prev ← R̂; work ← inverse(ĉ).
 */
export const StageMode = { FirstOrder: 0, EtdStart: 1, Etd2: 2 } as const;
export type StageMode = (typeof StageMode)[keyof typeof StageMode];

/** Buffers of one species used by the spectral stage (all length = cell count). */
export interface SpeciesBuffers {
  /** Two real fields; the step's work buffer alternates between them. */
  fields: [Float64Array, Float64Array];
  /** Scratch coefficients. */
  spec: Float64Array;
  /** ETD2 only: coefficients of the current state ĉ and of the previous reaction R̂ⁿ⁻¹. */
  chat?: Float64Array;
  rprev?: Float64Array;
}

/**
 * Runs the spectral stage for one species in place on `buffers.fields[workIndex]` and returns
 * the largest |value| of the new field (NaN when a value is NaN or infinite), so blow-up
 * detection runs on the thread that owns the species. Pure over its arguments so the serial
 * path and worker threads share it.
 */
export function runDiffusionStage(
  basis: SpectralBasis,
  coeffs: SpeciesCoefficients,
  buffers: SpeciesBuffers,
  mode: StageMode,
  workIndex: 0 | 1,
): number {
  const work = buffers.fields[workIndex];
  const spec = buffers.spec;
  basis.forward(work, spec);
  const n = spec.length;
  if (mode === StageMode.FirstOrder) {
    const m = coeffs.m!;
    for (let j = 0; j < n; j++) spec[j] *= m[j];
    basis.inverse(spec, work);
    return computeMaxAbs([work]);
  }
  const chat = buffers.chat!,
    rprev = buffers.rprev!,
    e = coeffs.e!;
  if (mode === StageMode.EtdStart) {
    const p1 = coeffs.p1!;
    for (let j = 0; j < n; j++) chat[j] = e[j] * chat[j] + p1[j] * spec[j];
  } else {
    const a = coeffs.a!,
      b = coeffs.b!;
    for (let j = 0; j < n; j++) chat[j] = e[j] * chat[j] + a[j] * spec[j] + b[j] * rprev[j];
  }
  rprev.set(spec);
  basis.inverse(chat, work);
  return computeMaxAbs([work]);
}
