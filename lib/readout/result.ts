import type { PatternSymmetry } from "./angular";
import type { ResolvedReadoutOptions } from "./options";

/**
 * How `uncertaintyUm` was obtained: "combined" = GUM combination of the sub-region spread, the
 * peak's localisation in noise and the interpolation residual (lib/readout/uncertainty.ts).
 */
export type UncertaintyMethod = "combined" | LegacyUncertaintyMethod;
/** Methods of readouts made before the combined uncertainty; their stored results still carry them. */
export type LegacyUncertaintyMethod = "subregion-sem" | "peak-half-width";

/** The outcome of one readout. Lengths in µm (and px of the source image), frequencies in cycles/µm. */
export interface WavelengthReadout {
  /** True when significance ≥ the threshold; otherwise the wavelength fields are null. */
  periodFound: boolean;
  /** Dominant Fourier wavelength 1/f_peak (µm); for spots the row spacing, not the neighbour distance. */
  wavelengthUm: number | null;
  /** The same in source-image pixels. */
  wavelengthPx: number | null;
  /** Standard uncertainty of wavelengthUm (µm, coverage factor k = 1), by `uncertaintyMethod`. */
  uncertaintyUm: number | null;
  uncertaintyPx: number | null;
  uncertaintyMethod: UncertaintyMethod | null;
  /** Half-width of the 95 % interval, λ ± 2u (µm, k = 2). */
  expandedUncertainty95Um: number | null;
  /** The components combined into uncertaintyUm (µm): sub-region spread, localisation in noise, interpolation residual. */
  uncertaintyComponentsUm: { subregion: number; localisation: number; resolution: number; mask: number } | null;
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
  /**
   * Where the symmetry call came from: the Fourier angular harmonics, or spots found in the image
   * (a disordered hexagonal packing whose Fourier ring is nearly uniform; lib/readout/spot-order.ts).
   */
  symmetrySource: "fourier" | "spots" | null;
  /** Spots found in the image and their order, when searched (fields the harmonics call labyrinth). */
  spotOrder: {
    count: number;
    psi6Local: number;
    psi6Global: number;
    roundness: number;
    nearestNeighbourMeanUm: number;
    nearestNeighbourSdUm: number;
    polarity: "bright" | "dark";
  } | null;
  /** The local wavelength's change across the field (µm), from a plane through the sub-region wavelengths. */
  wavelengthDrift: { fromUm: number; toUm: number; flagged: boolean } | null;
  /** Hexagonal spots only: nearest-neighbour distance a = (2/√3)·λ from the Fourier peak, or the mean distance between spots found in the image when symmetrySource is "spots" (µm). */
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
  treatedPixels: { saturated: number; bright: number; dark: number; total: number };
  warnings: string[];
}
