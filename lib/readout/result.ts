import type { PatternSymmetry } from "./angular";
import type { ResolvedReadoutOptions } from "./options";

/** How `uncertaintyUm` was obtained. */
export type UncertaintyMethod = "subregion-sem" | "peak-half-width";

/** The outcome of one readout. Lengths in µm (and px of the source image), frequencies in cycles/µm. */
export interface WavelengthReadout {
  /** True when significance ≥ the threshold; otherwise the wavelength fields are null. */
  periodFound: boolean;
  /** Dominant Fourier wavelength 1/f_peak (µm); for spots the row spacing, not the neighbour distance. */
  wavelengthUm: number | null;
  /** The same in source-image pixels. */
  wavelengthPx: number | null;
  /** One standard uncertainty of wavelengthUm (µm), by `uncertaintyMethod`. */
  uncertaintyUm: number | null;
  uncertaintyPx: number | null;
  uncertaintyMethod: UncertaintyMethod | null;
  /** SD/√n of λ over the usable sub-regions (µm), when there were ≥ 3. */
  subregionSemUm: number | null;
  /** Number of usable sub-regions behind subregionSemUm. */
  subregionCount: number;
  /** Peak half-width at half maximum propagated to λ: Δλ = λ·Δf/f (µm). */
  halfWidthUm: number | null;
  /** Peak ring power ÷ fitted background power at the peak (dimensionless). */
  significance: number;
  significanceThreshold: number;
  /** Wave-vector direction (perpendicular to stripes), degrees in [0, 180) from +x towards +y (image rows down); for hexagonal spots one wave vector in [0, 60). */
  orientationDeg: number | null;
  /** Mean resultant length of e^{2iθ} on the peak ring, 0 (isotropic) … 1 (one direction). */
  anisotropy: number;
  symmetry: PatternSymmetry | null;
  /** Angular harmonics behind the symmetry call: h₂ (stripes), h₄, h₆ (hexagonal). */
  symmetryScores: { h2: number; h4: number; h6: number };
  /** Hexagonal spots only: nearest-neighbour distance a = (2/√3)·λ (µm). */
  nearestNeighbourUm: number | null;
  nearestNeighbourUncertaintyUm: number | null;
  /** Autocorrelation cross-check, the wavelength it implies (µm), or null if not run/found. */
  autocorrelation: { firstMaximumUm: number; impliedWavelengthUm: number; direction: string; agrees: boolean } | null;
  /** Radially averaged power spectrum for plots: ring centres (cycles/µm), mean power, fitted background. */
  radialSpectrum: { frequencyPerUm: number[]; power: number[]; background: number[]; lowCutPerUm: number };
  /** Power on the peak ring by angle, 1° bins over 0 … 179° (for plots). */
  angularPower: number[];
  /** Settings used (without the mask bytes), the analysed grid and binning. */
  settings: Omit<ResolvedReadoutOptions, "excludeMask"> & {
    excludeMaskPixels: number;
    analysedWidthPx: number;
    analysedHeightPx: number;
    binFactor: number;
    paddedWidthPx: number;
    paddedHeightPx: number;
  };
  /** The tissue found inside the region: analysed only there, with a window tapering at its edge. */
  tissueRegion: {
    found: boolean;
    /** Fraction of the region's pixels analysed (1 = the whole region). */
    fraction: number;
    /** Convex outline of the tissue in source pixels [x, y], for drawing and as a polygon ROI; null without a mask. */
    outline: Array<[number, number]> | null;
  };
  /** Source pixels replaced by their surroundings before the spectrum. */
  treatedPixels: { saturated: number; bright: number; total: number };
  warnings: string[];
}
