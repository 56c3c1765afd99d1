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

/**
 * Replaces treated pixels by the Gaussian-weighted mean (σ = 2 px) of the untreated pixels
 * around them (normalised convolution, Knutsson & Westin 1993, CVPR); where none are near,
 * by `background`. Holes then carry the local level, neither a spike nor a step.
 */
export function inpaintTreated(
  data: Float32Array,
  width: number,
  height: number,
  treated: Uint8Array,
  background: Float32Array,
): void {
  const kept = new Float32Array(data.length),
    weight = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++)
    if (!treated[i]) {
      kept[i] = data[i];
      weight[i] = 1;
    }
  const num = blur(kept, width, height, 2),
    den = blur(weight, width, height, 2);
  for (let i = 0; i < data.length; i++) if (treated[i]) data[i] = den[i] > 1e-3 ? num[i] / den[i] : background[i];
}
