/** The region after ROI, inversion, binning, outlier treatment, tissue mask and background flattening (not yet windowed). */
export interface PreparedRegion {
  data: Float32Array;
  width: number;
  height: number;
  /** 1 = analysed (inside the ROI and the tissue, not excluded); null = every pixel. */
  included: Uint8Array | null;
  /** Integer binning applied to fit the analysis limit (1 = none). */
  binFactor: number;
  /** Pixel size of `data` (µm/px) = source pixel size × binFactor. */
  pixelSizeUm: number;
  /** Top-left of the region in source pixels. */
  x0: number;
  y0: number;
  /** The tissue found inside the region (analysed grid), or null: the whole region is analysed. */
  tissueMask: Uint8Array | null;
  /** Fraction of the region's pixels analysed after the tissue mask (1 without one). */
  tissueFraction: number;
  /** Source pixels replaced by their surroundings: saturated, and bright and dark outliers with their rim. */
  treatedSaturatedPx: number;
  treatedBrightPx: number;
  treatedDarkPx: number;
}
