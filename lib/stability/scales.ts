/**
 * Physical scales (SCIENCE.md §3): a dimensional model has ℓ = 1 µm and τ = 1 s; a
 * non-dimensional one has the ℓ (µm) and τ (s) the caller gives, or none (then physical
 * fields are null). Wavelength λ µm = ℓ·λ̂; growth rate σ 1/s = σ̂/τ; k 1/µm = k̂/ℓ.
 */
import { KineticsInputError } from "../kinetics/errors";
import type { CompiledKinetics, PhysicalScales } from "../kinetics/types";

export interface ResolvedScales {
  lengthScaleUm: number | null;
  timeScaleS: number | null;
}

export function resolveScales(kinetics: Pick<CompiledKinetics, "units">, scales: PhysicalScales = {}): ResolvedScales {
  const check = (field: keyof PhysicalScales) => {
    const v = scales[field];
    if (v === undefined) return null;
    if (typeof v !== "number" || !Number.isFinite(v) || v <= 0) {
      throw new KineticsInputError(field, `${field} must be a positive finite number (got ${String(v)}).`);
    }
    return v;
  };
  const lengthScaleUm = check("lengthScaleUm");
  const timeScaleS = check("timeScaleS");
  if (kinetics.units === "dimensional") {
    if (lengthScaleUm !== null || timeScaleS !== null) {
      throw new KineticsInputError(
        lengthScaleUm !== null ? "lengthScaleUm" : "timeScaleS",
        "This kinetics is dimensional (µm, s); length and time scales apply to non-dimensional kinetics only.",
      );
    }
    return { lengthScaleUm: 1, timeScaleS: 1 };
  }
  return { lengthScaleUm, timeScaleS };
}

/** Model wavenumber → 1/µm, or null without a length scale. */
export function wavenumberPerUm(k: number, s: ResolvedScales): number | null {
  return s.lengthScaleUm === null ? null : k / s.lengthScaleUm;
}

/** Model wavelength 2π/k → µm, or null. */
export function wavelengthUm(k: number, s: ResolvedScales): number | null {
  return s.lengthScaleUm === null || !(k > 0) ? null : (2 * Math.PI * s.lengthScaleUm) / k;
}

/** Model growth rate → 1/s, or null. */
export function growthRatePerS(sigma: number, s: ResolvedScales): number | null {
  return s.timeScaleS === null ? null : sigma / s.timeScaleS;
}
