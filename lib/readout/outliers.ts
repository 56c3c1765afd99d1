import { boxBlurWeights, boxHalfWidth } from "./box-blur";
import { blur } from "./flatten";

/** Pixels replaced by their local surroundings before the spectrum, and why. */
export interface TreatedPixels {
  /** 1 = treated, per pixel of the grid it was found on; null when none. */
  mask: Uint8Array | null;
  /** At the stored maximum or minimum, in blocks of at least 2 × 2 (a saturated detector, a clipped floor). */
  saturated: number;
  /** Bright outliers (debris) above the robust threshold, and the 1-px rim grown around them. */
  bright: number;
  /** Dark outliers (opaque debris) below the robust threshold, and their 1-px rim. */
  dark: number;
}

/** A robust |z| above this (in SDs estimated from the median absolute deviation) marks an outlier. */
export const OUTLIER_Z = 6;

/**
 * Clipped pixels: at the highest (saturated) or lowest (clipped floor) value of the region and part
 * of a 2 × 2 block at that value. A lone extreme (the crest of a clean stripe, the centre of a
 * spot) is not clipping; a clipped spot top or a debris core is a blob. Both ends are treated
 * alike, so a pattern and its negative read the same. Run on the stored values.
 */
export function findSaturated(
  data: Float32Array,
  width: number,
  height: number,
  extremes: { min: number; max: number; atMin: number; atMax: number },
): Uint8Array | null {
  // The extremes and their counts come from the pass that copied the region (extractRoi's stats).
  const { max: top, min: bottom, atMax: atTop, atMin: atBottom } = extremes;
  // A 2 × 2 block needs four pixels at one extreme: without them there is nothing to scan for.
  if (!(top > bottom) || (atTop < 4 && atBottom < 4)) return null;
  let mask: Uint8Array | null = null;
  // Only pixels at an extreme can start a block: the common frame has few, so the test per pixel is one comparison.
  for (let y = 0; y + 1 < height; y++) {
    const row = y * width;
    for (let x = 0; x + 1 < width; x++) {
      const i = row + x,
        v = data[i];
      if (v !== top && v !== bottom) continue;
      if (data[i + 1] === v && data[i + width] === v && data[i + width + 1] === v) {
        mask ??= new Uint8Array(data.length);
        mask[i] = mask[i + 1] = mask[i + width] = mask[i + width + 1] = 1;
      }
    }
  }
  return mask;
}

/** The values of every k-th included pixel (k chosen for at most ~100 000 values). */
function sampleValues(data: Float32Array, included: Uint8Array | null, skip: Uint8Array | null): Float32Array {
  const step = outlierSampleStep(data.length);
  const out: number[] = [];
  for (let i = 0; i < data.length; i += step) if ((!included || included[i]) && !(skip && skip[i])) out.push(data[i]);
  return Float32Array.from(out);
}

/** Every k-th index of a region of n pixels that the outlier limits are estimated from (at most ~100 000). */
export function outlierSampleStep(n: number): number {
  return Math.max(1, Math.floor(n / 100_000));
}

/**
 * The limits beyond which a flattened value is an outlier (see findOutliers), from a sample of the
 * analysed values in any order (reordered in place); null when there are too few values or no spread.
 */
export function outlierLimits(s: Float32Array): { upper: number; lower: number } | null {
  if (s.length < 16) return null;
  // Order statistics by selection, not a sort: the same elements a sort would put there (NaN aside).
  const q = (f: number) => selectKth(s, Math.min(s.length - 1, Math.floor(f * s.length)));
  const median = q(0.5);
  const dev = new Float32Array(s.length);
  for (let i = 0; i < s.length; i++) dev[i] = Math.abs(s[i] - median);
  const sd = 1.4826 * selectKth(dev, Math.floor(dev.length / 2));
  const upper = median + Math.max(OUTLIER_Z * sd, 2 * (q(0.98) - median));
  const lower = median - Math.max(OUTLIER_Z * sd, 2 * (median - q(0.02)));
  return upper > median && lower < median ? { upper, lower } : null;
}

/**
 * The k-th smallest value of `a` (0-based), reordering `a` in place: Hoare's selection (Hoare 1961,
 * CACM 4:321, "Algorithm 65: FIND") with a median-of-three pivot, O(n) on average. With a NaN in
 * `a` it sorts instead (a NaN compares false both ways), so the answer is always the sort's.
 */
export function selectKth(a: Float32Array, k: number): number {
  for (let i = 0; i < a.length; i++)
    if (a[i] !== a[i]) {
      a.sort();
      return a[k];
    }
  let lo = 0,
    hi = a.length - 1;
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // Median of three into a[mid], as the pivot.
    if (a[mid] < a[lo]) swap(a, mid, lo);
    if (a[hi] < a[lo]) swap(a, hi, lo);
    if (a[hi] < a[mid]) swap(a, hi, mid);
    const pivot = a[mid];
    let i = lo,
      j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        swap(a, i, j);
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

function swap(a: Float32Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/** Outliers of a flattened image on either side: 1 = treat; and which of them were dark. */
export interface FoundOutliers {
  mask: Uint8Array;
  /** 1 where the pixel is below the lower limit (dark debris), else 0; null when there is none. */
  dark: Uint8Array | null;
}

/**
 * Outliers of a background-flattened image, on both sides: above median + max(6·1.4826·MAD,
 * 2·(q98 − median)) (bright debris, fluorescent dust) or below median − max(6·1.4826·MAD,
 * 2·(median − q02)) (opaque particles in brightfield). The MAD term is the robust z-score of
 * Iglewicz & Hoaglin (1993, "How to detect and handle outliers", ASQC); the quantile terms keep
 * the tops of a sparse bright pattern, or the cores of a sparse dark one, which a MAD fitted mostly
 * to the gaps would call outliers, inside the pattern. Both sides alike: a pattern and its
 * negative read the same.
 */
export function findOutliers(
  residual: Float32Array,
  included: Uint8Array | null,
  already: Uint8Array | null,
): FoundOutliers | null {
  const limits = outlierLimits(sampleValues(residual, included, already));
  if (!limits) return null;
  const { upper, lower } = limits;
  let mask: Uint8Array | null = null,
    dark: Uint8Array | null = null;
  for (let i = 0; i < residual.length; i++) {
    const v = residual[i];
    if (v <= upper && v >= lower) continue;
    if ((included && !included[i]) || (already && already[i])) continue;
    mask ??= new Uint8Array(residual.length);
    mask[i] = 1;
    if (v < lower) (dark ??= new Uint8Array(residual.length))[i] = 1;
  }
  return mask ? { mask, dark } : null;
}

/** Grows a mask by one pixel (8-neighbourhood): the blurred rim of a debris particle goes with it. */
export function growByOne(mask: Uint8Array, width: number, height: number): Uint8Array {
  const out = mask.slice();
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      if (!mask[y * width + x]) continue;
      for (let dy = -1; dy <= 1; dy++)
        for (let dx = -1; dx <= 1; dx++) {
          const xx = x + dx,
            yy = y + dy;
          if (xx >= 0 && yy >= 0 && xx < width && yy < height) out[yy * width + xx] = 1;
        }
    }
  return out;
}

/** σ of the inpainting's Gaussian-weighted mean, px. */
const INPAINT_SIGMA_PX = 2;

/**
 * Above this share of treated pixels, blurring the whole frame twice costs less than the sums
 * around each treated pixel (measured on 4096²: 0.9 s for the two blurs on one thread; the sums,
 * 169 terms per pixel, about 10 ms per 20 000 treated pixels).
 */
const LOCAL_INPAINT_MAX_SHARE = 1 / 16;

/**
 * Replaces treated pixels by the Gaussian-weighted mean (σ = 2 px) of the untreated pixels
 * around them (normalised convolution, Knutsson & Westin 1993, CVPR); where none are near,
 * by the background under them (`data` − `residual`, the flattening's level). Holes then carry the
 * local level, neither a spike nor a step; `residual` stays `data` minus that background there.
 * The weights are those of `blur` (three running boxes per axis, edge-clamped). When few pixels
 * are treated, the sums are taken around each of them (boxBlurWeights) instead of blurring the
 * whole frame: the same weighted mean, in float64 throughout rather than rounded to float32
 * after each pass (tests/lib/readout/inpaint.test.ts bounds the difference).
 */
export function inpaintTreated(
  data: Float32Array,
  width: number,
  height: number,
  treated: Uint8Array,
  residual: Float32Array,
): void {
  let count = 0;
  for (let i = 0; i < treated.length; i++) count += treated[i];
  if (count === 0) return;
  if (count <= data.length * LOCAL_INPAINT_MAX_SHARE) {
    inpaintAround(data, width, height, treated, residual);
    return;
  }
  const kept = new Float32Array(data.length),
    weight = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++)
    if (!treated[i]) {
      kept[i] = data[i];
      weight[i] = 1;
    }
  const num = blur(kept, width, height, INPAINT_SIGMA_PX),
    den = blur(weight, width, height, INPAINT_SIGMA_PX);
  for (let i = 0; i < data.length; i++)
    if (treated[i]) replace(data, residual, i, den[i] > 1e-3 ? num[i] / den[i] : null);
}

/** data[i] := `value` (null: the background, data[i] − residual[i] in float32), and residual[i] := data[i] − background. */
function replace(data: Float32Array, residual: Float32Array, i: number, value: number | null): void {
  const background = Math.fround(data[i] - residual[i]);
  data[i] = value ?? background;
  residual[i] = data[i] - background;
}

/** inpaintTreated's weighted means, summed around each treated pixel (untreated pixels are only read). */
function inpaintAround(
  data: Float32Array,
  width: number,
  height: number,
  treated: Uint8Array,
  residual: Float32Array,
): void {
  const r = boxHalfWidth(INPAINT_SIGMA_PX);
  const reach = 3 * r,
    span = 2 * reach + 1;
  const kx = boxBlurWeights(width, r),
    ky = boxBlurWeights(height, r);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    for (let x = 0; x < width; x++) {
      if (!treated[row + x]) continue;
      let num = 0,
        den = 0;
      const y0 = Math.max(0, y - reach),
        y1 = Math.min(height - 1, y + reach),
        x0 = Math.max(0, x - reach),
        x1 = Math.min(width - 1, x + reach);
      for (let yy = y0; yy <= y1; yy++) {
        const wy = ky[y * span + (yy - y + reach)];
        if (wy === 0) continue;
        const line = yy * width;
        let rowNum = 0,
          rowDen = 0;
        for (let xx = x0; xx <= x1; xx++) {
          const i = line + xx;
          if (treated[i]) continue;
          const w = kx[x * span + (xx - x + reach)];
          rowNum += w * data[i];
          rowDen += w;
        }
        num += wy * rowNum;
        den += wy * rowDen;
      }
      replace(data, residual, row + x, den > 1e-3 ? num / den : null);
    }
  }
}
