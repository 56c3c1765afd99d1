import { binPixels } from "./bin-pixels";
import { blur } from "./flatten";
import { distanceInside, fillHoles, keepLargestComponent } from "./mask-shape";
import { otsuSplit } from "./otsu";
import { computeTextureMap, type TextureMap } from "./texture-map";

/** Whether the readout looks for the tissue inside the region. */
export type TissueMaskMode = "auto" | "off";

/** Above this fraction of the region the "tissue" is the whole region: no mask. */
export const WHOLE_REGION_FRACTION = 0.95;
/** Below this fraction of the region a "tissue" is too small to trust: no mask. */
export const MIN_TISSUE_FRACTION = 0.2;
/** The tissue's texture (SD) must be at least this fraction of the region's intensity range (1st–99th percentile). */
export const MIN_TEXTURE_CONTRAST = 2e-3;
/** The textured side must have at least this many times the texture-to-noise ratio of the other. */
export const MIN_TEXTURE_RATIO = 4;
/** On the textured side, the pattern's variance must be at least this many times the noise's. */
export const MIN_TISSUE_SNR = 1;
/** Longest side (px) of the grid the tissue is searched on. */
const SEARCH_SIDE_PX = 1024;
/** Half-width of the band around the texture edge that a brightness step may move (window SDs). */
const BAND_WINDOWS = 5;

export interface TissueRegion {
  /** 1 = tissue, per pixel of the analysed grid; null = the whole region (no tissue edge found). */
  mask: Uint8Array | null;
  /** Fraction of the region's analysed pixels inside the mask (1 without a mask). */
  fraction: number;
}

/** 99th minus 1st percentile of the analysed intensities (every few pixels). */
function intensityRange(data: Float32Array, included: Uint8Array | null): number {
  const step = Math.max(1, Math.floor(data.length / 50_000));
  const v: number[] = [];
  for (let i = 0; i < data.length; i += step) if (!included || included[i]) v.push(data[i]);
  v.sort((a, b) => a - b);
  return v.length ? v[Math.floor(0.99 * (v.length - 1))] - v[Math.floor(0.01 * (v.length - 1))] : 0;
}

/** Mean of `values` over the cells of `where`, in a Gaussian window of σ (cells): a local level. */
function localLevel(values: Float32Array, where: Uint8Array, t: TextureMap, sigma: number): Float32Array {
  const num = blur(
    Float32Array.from(values, (v, j) => (where[j] ? v : 0)),
    t.columns,
    t.rows,
    sigma,
  );
  const den = blur(Float32Array.from(where), t.columns, t.rows, sigma);
  return Float32Array.from(num, (v, j) => (den[j] > 0.005 ? v / den[j] : NaN));
}

/**
 * Where the texture edge meets a brightness step (tissue on a darker or lighter slide), the
 * texture window smears the edge outwards; the brightness, averaged in the same symmetric window,
 * crosses the midpoint of the two nearby levels (deep inside and far outside, a few windows
 * around) at the edge itself. Cells within five windows of the texture edge whose levels differ by
 * more than twice the local SD of the pattern take the side of that midpoint. Returns which cells
 * were so decided.
 */
function refineByBrightness(cells: Uint8Array, t: TextureMap): Uint8Array {
  const { columns: cw, rows: ch, windowCells: s, brightness, use } = t;
  const inside = distanceInside(cells, cw, ch, false);
  const outside = distanceInside(
    Uint8Array.from(cells, (v) => 1 - v),
    cw,
    ch,
    false,
  );
  const deepIn = Uint8Array.from(cells, (_, j) => (use[j] && inside[j] > BAND_WINDOWS * s ? 1 : 0));
  const farOut = Uint8Array.from(cells, (_, j) => (use[j] && outside[j] > BAND_WINDOWS * s ? 1 : 0));
  const levelIn = localLevel(brightness, deepIn, t, 2 * BAND_WINDOWS * s),
    levelOut = localLevel(brightness, farOut, t, 2 * BAND_WINDOWS * s),
    sdIn = localLevel(t.sd, deepIn, t, 2 * BAND_WINDOWS * s);
  const decided = new Uint8Array(cells.length);
  const next = cells.slice();
  for (let j = 0; j < cells.length; j++) {
    if (!use[j] || inside[j] > BAND_WINDOWS * s || outside[j] > BAND_WINDOWS * s) continue;
    const a = levelIn[j],
      b = levelOut[j];
    if (!(Math.abs(a - b) > 2 * sdIn[j])) continue; // NaN (no level near) or no clear step
    decided[j] = 1;
    const mid = (a + b) / 2;
    next[j] = (brightness[j] - mid) * (a - mid) > 0 ? 1 : 0;
  }
  cells.set(next);
  return decided;
}

/**
 * The tissue in a background-flattened region (SCIENCE.md §5, step 2). Tissue carries the pattern;
 * slide and mounting medium carry only noise. So the side is decided by texture, not brightness
 * (a slide may be darker or lighter than the tissue): the texture-to-noise map
 * (`computeTextureMap`) is split in log by Otsu's threshold (Otsu 1979, IEEE Trans. SMC 9:62).
 * Kept: the largest connected part, holes filled, its edge moved to the brightness step where
 * there is one, else eroded by one window SD (the window spreads a textured edge outwards).
 * No mask when the sides differ less than MIN_TEXTURE_RATIO×, the textured side is not clearly
 * above noise or far below the image's contrast, or the tissue covers under 20 % or ≥ 95 % of the region.
 */
export function findTissueRegion(
  residual: Float32Array,
  intensity: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
): TissueRegion {
  // Large regions are searched on a grid binned to at most SEARCH_SIDE_PX (a pattern shorter than
  // about 3 bins then shows no texture, and the whole region is analysed).
  const f = tissueSearchFactor(width, height);
  if (f <= 1) return findTissueOnGrid(residual, intensity, width, height, included);
  const r = binPixels(residual, width, height, included, f);
  const b = binPixels(intensity, width, height, included, f);
  return findTissueOnBinned(r, b, f, width, height, included);
}

/** The binning of a region's grid that the tissue is searched on (1 = none). */
export function tissueSearchFactor(width: number, height: number): number {
  return Math.ceil(Math.max(width, height) / SEARCH_SIDE_PX);
}

/** A region binned by `tissueSearchFactor` (binPixels' result). */
export interface BinnedGrid {
  data: Float32Array;
  width: number;
  height: number;
  included: Uint8Array | null;
}

/**
 * findTissueRegion on the residual `r` and the intensity `b` already binned by f (as binPixels
 * bins them), the mask brought back to the width × height grid.
 */
export function findTissueOnBinned(
  r: BinnedGrid,
  b: BinnedGrid,
  f: number,
  width: number,
  height: number,
  included: Uint8Array | null,
): TissueRegion {
  const coarse = findTissueOnGrid(r.data, b.data, r.width, r.height, r.included);
  if (!coarse.mask) return coarse;
  const mask = new Uint8Array(width * height);
  let inMask = 0,
    total = 0;
  for (let y = 0; y < height; y++) {
    const row = Math.min(r.height - 1, (y / f) | 0) * r.width;
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      if (included && !included[i]) continue;
      total++;
      if (coarse.mask[row + Math.min(r.width - 1, (x / f) | 0)]) {
        mask[i] = 1;
        inMask++;
      }
    }
  }
  return { mask, fraction: total > 0 ? inMask / total : 1 };
}

function findTissueOnGrid(
  residual: Float32Array,
  intensity: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
): TissueRegion {
  const none: TissueRegion = { mask: null, fraction: 1 };
  const t = computeTextureMap(residual, intensity, width, height, included);
  if (!t) return none;
  const { columns: cw, rows: ch, cellPx: c, use } = t;
  const split = otsuSplit(t.logSnr, use);
  if (
    !split ||
    split.highMean - split.lowMean < Math.log(MIN_TEXTURE_RATIO) ||
    split.highMean < Math.log(MIN_TISSUE_SNR)
  )
    return none;
  let cells = new Uint8Array(cw * ch);
  let usable = 0;
  const textured: number[] = [];
  for (let j = 0; j < cells.length; j++) {
    usable += use[j];
    cells[j] = use[j] && t.logSnr[j] >= split.threshold ? 1 : 0;
    if (cells[j]) textured.push(t.sd[j]);
  }
  // Texture far below the image's own contrast is the rounding and smoothing of a plain background, not a pattern.
  textured.sort((a, b) => a - b);
  if (!(textured[textured.length >> 1] >= MIN_TEXTURE_CONTRAST * intensityRange(intensity, included))) return none;
  keepLargestComponent(cells, cw, ch);
  fillHoles(cells, cw, ch);
  const decided = refineByBrightness(cells, t);
  keepLargestComponent(cells, cw, ch);
  fillHoles(cells, cw, ch);
  // Where a brightness step placed the edge, half a cell of margin; elsewhere the texture edge is
  // one window SD too far out. The grid's border is not an edge of the tissue.
  const dist = distanceInside(cells, cw, ch, false);
  cells = Uint8Array.from(cells, (v, j) => (v && use[j] && dist[j] > (decided[j] ? 0.5 : t.windowCells) ? 1 : 0));
  let kept = 0;
  for (const v of cells) kept += v;
  if (usable === 0 || kept >= WHOLE_REGION_FRACTION * usable || kept < MIN_TISSUE_FRACTION * usable) return none;
  // Back to the analysed grid (cells at the right and bottom edges extend to the border).
  const mask = new Uint8Array(width * height);
  let inMask = 0,
    total = 0;
  for (let y = 0; y < height; y++) {
    const crow = Math.min(ch - 1, (y / c) | 0) * cw;
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      if (included && !included[i]) continue;
      total++;
      if (cells[crow + Math.min(cw - 1, (x / c) | 0)]) {
        mask[i] = 1;
        inMask++;
      }
    }
  }
  return { mask, fraction: total > 0 ? inMask / total : 1 };
}
