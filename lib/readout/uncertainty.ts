/**
 * The standard uncertainty of a readout's wavelength (coverage factor k = 1) and its 95 % interval,
 * combined by the law of propagation of uncertainty for uncorrelated inputs (GUM, JCGM 100:2008
 * §5.1.2): u_c² = u_A² + u_loc² + u_res², all in frequency, then Δλ = λ²·Δf.
 *
 * - u_A, Type A (GUM §4.2): the spread of λ over sub-regions, SD/√n_eff — what varies across the field.
 * - u_loc, Type B (GUM §4.3): how well noise lets the peak be located. For a sinusoid in white noise
 *   the Cramér–Rao bound on frequency falls as 1/√SNR (Rife & Boorstyn 1974, IEEE Trans. Inf. Theory
 *   20:591); here u_loc = κ·Δf_bin/√SNR_bin, SNR_bin = the strongest bin's power ÷ the fitted
 *   background at that frequency.
 * - u_res, Type B: the residual of interpolating the peak between bins with a log-parabola, bounded
 *   by a small fraction δ of a bin whatever the noise (a perfect lattice still has it), u_res = δ·Δf_bin.
 * - u_mask, Type B: a mask (tissue region, polygon ROI, excluded pixels) makes the aperture irregular, so
 *   the peak's lobe is no longer the window's and its interpolation is biased; u_mask = μ·f_ex·Δf_bin
 *   with f_ex the excluded share of the analysed rectangle; smaller where the window tapers at the
 *   mask's edge (tissue masks) than for a hard edge.
 *
 * κ and δ were calibrated on generated frames with exact truth (tests/lib/readout/
 * uncertainty-calibration.test.ts): |error| ≤ 2u in ≥ 95 % of cases and u not more than 5× the
 * error spread of any family. The 95 % interval is λ ± 2u (GUM §6.3.3, k = 2 for an approximately
 * normal distribution).
 */
export const LOCALISATION_KAPPA = 1;
export const RESOLUTION_BINS = 0.02;
/** μ for a hard-edged mask (polygon ROI, excluded pixels) and for a tissue mask the window tapers at. */
export const MASK_BINS = { hard: 1, tapered: 0.3 } as const;
export const COVERAGE_FACTOR_95 = 2;

export interface WavelengthUncertaintyInput {
  /** λ of the analysed grid (px). */
  wavelengthPx: number;
  /** Frequency bin of the padded spectrum along the peak's direction (cycles/px). */
  binPerPx: number;
  /** SD/√n_eff of the sub-region wavelengths (px), null when too few sub-regions were usable. */
  subregionSemPx: number | null;
  /** Share of the analysed rectangle outside the mask, 0 … 1 (0 without a mask). */
  excludedFraction?: number;
  /** True when the window tapers at the mask's edge (a tissue mask). */
  maskTapered?: boolean;
  /** Strongest peak bin's power ÷ background power at that frequency. */
  peakSnr: number;
}

export interface WavelengthUncertainty {
  /** Combined standard uncertainty u_c (px, k = 1). */
  uncertaintyPx: number;
  /** Half-width of the 95 % interval, k·u_c with k = 2 (px). */
  expanded95Px: number;
  /** The three components (px). */
  subregionPx: number;
  localisationPx: number;
  resolutionPx: number;
  maskPx: number;
}

export function combineWavelengthUncertainty(input: WavelengthUncertaintyInput): WavelengthUncertainty {
  const { wavelengthPx: lambda, binPerPx, subregionSemPx, peakSnr } = input;
  const toPx = lambda * lambda * binPerPx; // Δλ for one bin: |dλ/df| = λ²
  const snr = Number.isFinite(peakSnr) && peakSnr > 0 ? peakSnr : 1;
  const localisationPx = (toPx * LOCALISATION_KAPPA) / Math.sqrt(snr);
  const resolutionPx = toPx * RESOLUTION_BINS;
  const maskPx = toPx * MASK_BINS[input.maskTapered ? "tapered" : "hard"] * (input.excludedFraction ?? 0);
  const subregionPx = subregionSemPx ?? 0;
  const uncertaintyPx = Math.sqrt(subregionPx ** 2 + localisationPx ** 2 + resolutionPx ** 2 + maskPx ** 2);
  return {
    uncertaintyPx,
    expanded95Px: COVERAGE_FACTOR_95 * uncertaintyPx,
    subregionPx,
    localisationPx,
    resolutionPx,
    maskPx,
  };
}
