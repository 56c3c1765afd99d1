import { phi1, phi2 } from "./phi-functions";

/**
 * Time-stepping schemes, all semi-implicit spectral (diffusion handled per cosine mode, reactions
 * explicit), with L = −D k² for a mode of wavenumber k and step h:
 * - `implicit-euler`: ĉ⁺ = (c + hR)^ / (1 + hDk²) — first order (SCIENCE.md §8).
 * - `integrating-factor`: ĉ⁺ = e^{hL} (c + hR)^ — diffusion exact, first order.
 * - `etd2`: ĉ⁺ = e^{hL} ĉ + h(φ1 + φ2)(hL) R̂ⁿ − hφ2(hL) R̂ⁿ⁻¹, second order
 *   (Cox S.M. & Matthews P.C. (2002) J. Comput. Phys. 176:430); its first step is ETD1,
 *   ĉ⁺ = e^{hL} ĉ + hφ1(hL) R̂.
 * With adaptive steps (`adaptive` option) the `etd2` scheme is taken in its Runge–Kutta form ETD2RK
 * (Cox & Matthews 2002, eq. (22)), which needs no earlier step of the same size:
 *   â = e^{hL} ĉ + hφ1(hL) R̂(c)   (ETD1, the embedded first-order solution)
 *   ĉ⁺ = â + hφ2(hL) (R̂(a) − R̂(c))   (second order)
 * and ĉ⁺ − â is the local error estimate of the pair (step-control.ts).
 */
export type SchemeName = "implicit-euler" | "integrating-factor" | "etd2";

export const SCHEME_NAMES: readonly SchemeName[] = ["implicit-euler", "integrating-factor", "etd2"];

/** Observed order of accuracy in time of each scheme. */
export const SCHEME_ORDER: Readonly<Record<SchemeName, number>> = {
  "implicit-euler": 1,
  "integrating-factor": 1,
  etd2: 2,
};

/** Per-mode multipliers of one species (length = number of cosine coefficients). */
export interface SpeciesCoefficients {
  /** First-order schemes: ĉ⁺ = m · (c + hR)^. */
  m?: Float64Array;
  /** ETD: e^{hL}. */
  e?: Float64Array;
  /** ETD1 start: hφ1(hL). */
  p1?: Float64Array;
  /** ETD2: h(φ1 + φ2)(hL). */
  a?: Float64Array;
  /** ETD2: −hφ2(hL). */
  b?: Float64Array;
  /** ETD2RK (adaptive): hφ2(hL). */
  p2?: Float64Array;
}

/** Fills the multipliers of `scheme` for diffusivity D (µm²/s) and step h (s) into `target`. */
export function fillSchemeCoefficients(
  scheme: SchemeName,
  k2PerUm2: Float64Array,
  diffusionUm2PerS: number,
  dtS: number,
  target: SpeciesCoefficients,
): void {
  const n = k2PerUm2.length;
  for (let j = 0; j < n; j++) {
    const z = -dtS * diffusionUm2PerS * k2PerUm2[j];
    if (scheme === "implicit-euler") target.m![j] = 1 / (1 - z);
    else if (scheme === "integrating-factor") target.m![j] = Math.exp(z);
    else {
      const f1 = phi1(z),
        f2 = phi2(z);
      target.e![j] = Math.exp(z);
      target.p1![j] = dtS * f1;
      if (target.a) target.a[j] = dtS * (f1 + f2);
      if (target.b) target.b[j] = -dtS * f2;
      if (target.p2) target.p2[j] = dtS * f2;
    }
  }
}

/** Which multiplier arrays a scheme needs (ETD2RK with adaptive steps: e, p1, p2). */
export function coefficientNames(scheme: SchemeName, adaptive = false): (keyof SpeciesCoefficients)[] {
  if (adaptive) return ["e", "p1", "p2"];
  return scheme === "etd2" ? ["e", "p1", "a", "b"] : ["m"];
}
