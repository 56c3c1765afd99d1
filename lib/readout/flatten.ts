import { blur } from "./box-blur";
import { COARSE_SIGMA_PX, subtractCoarseBackground } from "./coarse-background";

export { blur };

/**
 * How the slow background is removed before the FFT. "auto": a least-squares plane, then a
 * Gaussian background (σ = shorter side/8) subtracted inside the analysed pixels only.
 */
export type FlattenMethod = "auto" | "plane" | "blur" | "none";

type PlaneSums = { sumZ: number; sumXZ: number; sumYZ: number };
type Plane = { c0: number; c1: number; c2: number };

/** Σx, Σy, Σx², Σy², Σxy over a full width × height grid, in closed form. */
function gridMoments(width: number, height: number) {
  const Sx = ((width - 1) * width) / 2,
    Sxx = ((width - 1) * width * (2 * width - 1)) / 6;
  const Sy = ((height - 1) * height) / 2,
    Syy = ((height - 1) * height * (2 * height - 1)) / 6;
  return { n: width * height, sx: Sx * height, sxx: Sxx * height, sy: Sy * width, syy: Syy * width, sxy: Sx * Sy };
}

/** The normal equations solved by Cramer's rule; null when they are singular. */
function solvePlane(
  n: number,
  sx: number,
  sy: number,
  sxx: number,
  syy: number,
  sxy: number,
  sz: number,
  sxz: number,
  syz: number,
): Plane | null {
  const det3 = (a: number[]) =>
    a[0] * (a[4] * a[8] - a[5] * a[7]) - a[1] * (a[3] * a[8] - a[5] * a[6]) + a[2] * (a[3] * a[7] - a[4] * a[6]);
  const m = [n, sx, sy, sx, sxx, sxy, sy, sxy, syy];
  const d = det3(m);
  if (!(Math.abs(d) > 1e-9 * Math.max(1, n) ** 3)) return null;
  const c0 = det3([sz, sx, sy, sxz, sxx, sxy, syz, sxy, syy]) / d;
  const c1 = det3([n, sz, sy, sx, sxz, sxy, sy, syz, syy]) / d;
  const c2 = det3([n, sx, sz, sx, sxx, sxz, sy, sxy, syz]) / d;
  return { c0, c1, c2 };
}

/** The least-squares plane of a full grid from its sums Σz, Σx·z, Σy·z (as subtractPlane fits it); null when singular. */
export function planeCoefficients(width: number, height: number, sums: PlaneSums): Plane | null {
  const g = gridMoments(width, height);
  return solvePlane(g.n, g.sx, g.sy, g.sxx, g.syy, g.sxy, sums.sumZ, sums.sumXZ, sums.sumYZ);
}

/**
 * Least-squares plane z = c₀ + c₁x + c₂y over the included pixels, subtracted in place
 * (normal equations, 3×3, solved by Cramer's rule). Without a mask, returns the residual's SD
 * (n − 1) when its mean is zero to rounding, so the caller can skip subtractMean; else null.
 * With `from` (full grid and `sums` only), the pixels are read from there and `data` only
 * written: a copy and the subtraction in one pass.
 */
export function subtractPlane(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sums?: PlaneSums,
  from: Float32Array = data,
): number | null {
  let n = 0,
    sx = 0,
    sy = 0,
    sxx = 0,
    syy = 0,
    sxy = 0,
    sz = 0,
    sxz = 0,
    syz = 0;
  if (included) {
    for (let y = 0; y < height; y++) {
      const row = y * width;
      for (let x = 0; x < width; x++) {
        if (!included[row + x]) continue;
        const z = from[row + x];
        n++;
        sx += x;
        sy += y;
        sxx += x * x;
        syy += y * y;
        sxy += x * y;
        sz += z;
        sxz += x * z;
        syz += y * z;
      }
    }
  } else {
    // Full grid: the coordinate sums have closed forms, so one pass only sums z and x·z per row.
    ({ n, sx, sxx, sy, syy, sxy } = gridMoments(width, height));
    // Sums taken by the pass that copied the region (extractRoi's stats) spare this one.
    if (sums) ({ sumZ: sz, sumXZ: sxz, sumYZ: syz } = sums);
    else
      for (let y = 0; y < height; y++) {
        const row = y * width;
        let rz = 0,
          rxz = 0;
        for (let x = 0; x < width; x++) {
          const z = from[row + x];
          rz += z;
          rxz += x * z;
        }
        sz += rz;
        sxz += rxz;
        syz += y * rz;
      }
  }
  const plane = solvePlane(n, sx, sy, sxx, syy, sxy, sz, sxz, syz);
  if (!plane) {
    if (from !== data) data.set(from);
    return subtractMean(data, included);
  }
  const { c0, c1, c2 } = plane;
  let s = 0,
    ss = 0;
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const base = c0 + c2 * y;
    let rowS = 0,
      rowSs = 0;
    for (let x = 0; x < width; x++) {
      const v = from[row + x] - (base + c1 * x);
      data[row + x] = v;
      rowS += v;
      rowSs += v * v;
    }
    s += rowS;
    ss += rowSs;
  }
  if (included || n < 2) return null;
  // The least-squares plane has a constant term, so the residual's mean is zero but for rounding.
  const mean = s / n;
  const sd = Math.sqrt(Math.max(0, (ss - n * mean * mean) / (n - 1)));
  return Math.abs(mean) <= 1e-6 * sd ? sd : null;
}

/**
 * Subtracts a heavily blurred copy (normalised convolution, so excluded pixels do not leak in:
 * Knutsson & Westin 1993, CVPR). σ should be several wavelengths so the pattern survives.
 */
export function subtractBlur(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sigmaPx: number,
): void {
  if (sigmaPx >= COARSE_SIGMA_PX) {
    subtractCoarseBackground(data, data, width, height, included, sigmaPx);
    return;
  }
  if (!included) {
    const bg = blur(data, width, height, sigmaPx);
    for (let i = 0; i < data.length; i++) data[i] -= bg[i];
    return;
  }
  const masked = new Float32Array(data.length);
  const weight = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++)
    if (included[i]) {
      masked[i] = data[i];
      weight[i] = 1;
    }
  const num = blur(masked, width, height, sigmaPx);
  const den = blur(weight, width, height, sigmaPx);
  for (let i = 0; i < data.length; i++) data[i] -= den[i] > 1e-6 ? num[i] / den[i] : 0;
}

/**
 * `data` minus its heavily blurred copy, as a new array (`data` is left as it is): on large
 * backgrounds one pass that reads `data` and writes the result, instead of a copy and a
 * subtraction. Without a mask, on large backgrounds, the same pass also removes the residual's
 * mean and returns its SD (n − 1), as subtractMean would; otherwise `sd` is null.
 */
export function blurResidual(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sigmaPx: number,
): { residual: Float32Array; sd: number | null } {
  if (sigmaPx >= COARSE_SIGMA_PX) {
    const residual = new Float32Array(data.length);
    const sd = subtractCoarseBackground(data, residual, width, height, included, sigmaPx, true);
    return { residual, sd };
  }
  const residual = data.slice();
  subtractBlur(residual, width, height, included, sigmaPx);
  return { residual, sd: null };
}

/** Subtracts the mean of the included pixels, sets excluded pixels to 0; returns the SD (n − 1). */
export function subtractMean(data: Float32Array, included: Uint8Array | null): number {
  if (!included) return subtractMeanAll(data);
  let n = 0,
    s = 0;
  for (let i = 0; i < data.length; i++)
    if (!included || included[i]) {
      s += data[i];
      n++;
    }
  const mean = n > 0 ? s / n : 0;
  let ss = 0;
  for (let i = 0; i < data.length; i++) {
    if (!included || included[i]) {
      const v = data[i] - mean;
      data[i] = v;
      ss += v * v;
    } else data[i] = 0;
  }
  return n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
}

/** subtractMean without a mask: the same sums in the same order, without a test per pixel. */
function subtractMeanAll(data: Float32Array): number {
  const n = data.length;
  let s = 0;
  for (let i = 0; i < n; i++) s += data[i];
  const mean = n > 0 ? s / n : 0;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const v = data[i] - mean;
    data[i] = v;
    ss += v * v;
  }
  return n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
}
