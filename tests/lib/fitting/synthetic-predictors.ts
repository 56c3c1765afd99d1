/**
 * Closed-form stand-ins for a kinetics model, used to test the wavelength layer before (and
 * independently of) the real dispersion engine. Their form follows the scaling λ ∝ √(D/γ) of
 * SCIENCE.md §3 (λ = 2π/k with k² ∝ rate/diffusivity); the numbers are invented.
 */
import type { WavelengthPredictor } from "@/lib/fitting";

/** Dose of each condition, invented for the tests. */
export const DOSES: Record<string, number> = { control: 0, low: 1, mid: 2, high: 4, top: 6, max: 8 };

/**
 * Model A: λ = 2π·√(D/k), k = k0·(1 + s·dose). Turing when k ≤ kMax (a stand-in for the edge of the
 * Turing region); outside it the model still returns its wavelength, flagged non-Turing.
 */
export function modelA(kMax = Infinity): WavelengthPredictor {
  return (p, condition) => {
    const k = p.k0 * (1 + p.s * DOSES[condition]);
    if (!(k > 0)) return null;
    return { wavelengthUm: 2 * Math.PI * Math.sqrt(p.D / k), turing: k <= kMax };
  };
}

/** Model B: λ = λ0/(1 + s·dose), a different dose dependence (always Turing). */
export const modelB: WavelengthPredictor = (p, condition) => ({
  wavelengthUm: p.lambda0 / (1 + p.s * DOSES[condition]),
  turing: true,
});

/** Model C: λ = 2π·√(D/k) for one condition, no dose (two parameters, one combination D/k). */
export const modelC: WavelengthPredictor = (p) => ({ wavelengthUm: 2 * Math.PI * Math.sqrt(p.D / p.k), turing: true });
