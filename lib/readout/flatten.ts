/**
 * How the slow background is removed before the FFT. "auto": a least-squares plane, then a
 * Gaussian background (σ = shorter side/8) subtracted inside the analysed pixels only.
 */
export type FlattenMethod = "auto" | "plane" | "blur" | "none";

/**
 * Least-squares plane z = c₀ + c₁x + c₂y over the included pixels, subtracted in place
 * (normal equations, 3×3, solved by Cramer's rule).
 */
export function subtractPlane(data: Float32Array, width: number, height: number, included: Uint8Array | null): void {
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
        const z = data[row + x];
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
    n = width * height;
    const Sx = ((width - 1) * width) / 2,
      Sxx = ((width - 1) * width * (2 * width - 1)) / 6;
    const Sy = ((height - 1) * height) / 2,
      Syy = ((height - 1) * height * (2 * height - 1)) / 6;
    sx = Sx * height;
    sxx = Sxx * height;
    sy = Sy * width;
    syy = Syy * width;
    sxy = Sx * Sy;
    for (let y = 0; y < height; y++) {
      const row = y * width;
      let rz = 0,
        rxz = 0;
      for (let x = 0; x < width; x++) {
        const z = data[row + x];
        rz += z;
        rxz += x * z;
      }
      sz += rz;
      sxz += rxz;
      syz += y * rz;
    }
  }
  const det3 = (a: number[]) =>
    a[0] * (a[4] * a[8] - a[5] * a[7]) - a[1] * (a[3] * a[8] - a[5] * a[6]) + a[2] * (a[3] * a[7] - a[4] * a[6]);
  const m = [n, sx, sy, sx, sxx, sxy, sy, sxy, syy];
  const d = det3(m);
  if (!(Math.abs(d) > 1e-9 * Math.max(1, n) ** 3)) {
    subtractMean(data, included);
    return;
  }
  const c0 = det3([sz, sx, sy, sxz, sxx, sxy, syz, sxy, syy]) / d;
  const c1 = det3([n, sz, sy, sx, sxz, sxy, sy, syz, syy]) / d;
  const c2 = det3([n, sx, sz, sx, sxx, sxz, sy, sxy, syz]) / d;
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const base = c0 + c2 * y;
    for (let x = 0; x < width; x++) data[row + x] -= base + c1 * x;
  }
}

/** One pass of a running-box mean of half-width r along rows (stride 1) or columns (stride width). */
function boxPass(
  src: Float32Array,
  dst: Float32Array,
  len: number,
  count: number,
  step: number,
  stride: number,
  r: number,
): void {
  for (let line = 0; line < count; line++) {
    const base = line * stride;
    let acc = 0;
    for (let k = 0; k <= Math.min(r, len - 1); k++) acc += src[base + k * step];
    for (let k = 0; k < len; k++) {
      const lo = k - r,
        hi = k + r;
      dst[base + k * step] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
      if (hi + 1 < len) acc += src[base + (hi + 1) * step];
      if (lo >= 0) acc -= src[base + lo * step];
    }
  }
}

/** Three box passes per axis approximate a Gaussian of SD σ (Wells 1986, IEEE PAMI 8:234). */
export function blur(data: Float32Array, width: number, height: number, sigmaPx: number): Float32Array {
  const r = Math.max(1, Math.round(Math.sqrt(sigmaPx * sigmaPx + 1) - 0.5)); // 3 boxes of width 2r+1: σ² = 3·((2r+1)²−1)/12 ≈ r²
  let a = Float32Array.from(data);
  let b = new Float32Array(data.length);
  for (let p = 0; p < 3; p++) {
    boxPass(a, b, width, height, 1, width, r);
    [a, b] = [b, a];
    boxPass(a, b, height, width, width, 1, r);
    [a, b] = [b, a];
  }
  return a;
}

/** Above this σ (px) the background is computed on a grid binned by ⌊σ/8⌋ and interpolated back. */
const COARSE_SIGMA_PX = 24;

/**
 * The normalised Gaussian background on a grid binned by f, bilinearly interpolated back to every
 * pixel. A background of σ ≥ 24 px varies little over f ≤ σ/8 px, so the error is far below the
 * pattern's, and a 4096² frame needs a blur of 512² instead of 4096².
 */
function coarseBackground(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sigmaPx: number,
): Float32Array {
  const f = Math.max(2, Math.floor(sigmaPx / 8));
  const bw = Math.ceil(width / f),
    bh = Math.ceil(height / f);
  const sum = new Float32Array(bw * bh),
    count = new Float32Array(bw * bh);
  for (let y = 0; y < height; y++) {
    const brow = ((y / f) | 0) * bw;
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      if (included && !included[i]) continue;
      const j = brow + ((x / f) | 0);
      sum[j] += data[i];
      count[j]++;
    }
  }
  const num = blur(sum, bw, bh, sigmaPx / f),
    den = blur(count, bw, bh, sigmaPx / f);
  const level = Float32Array.from(num, (v, j) => (den[j] > 1e-6 ? v / den[j] : 0));
  const out = new Float32Array(data.length);
  for (let y = 0; y < height; y++) {
    const gy = Math.min(bh - 1, Math.max(0, (y + 0.5) / f - 0.5));
    const y0 = Math.floor(gy),
      y1 = Math.min(bh - 1, y0 + 1),
      ty = gy - y0;
    for (let x = 0; x < width; x++) {
      const gx = Math.min(bw - 1, Math.max(0, (x + 0.5) / f - 0.5));
      const x0 = Math.floor(gx),
        x1 = Math.min(bw - 1, x0 + 1),
        tx = gx - x0;
      const top = level[y0 * bw + x0] * (1 - tx) + level[y0 * bw + x1] * tx;
      const bottom = level[y1 * bw + x0] * (1 - tx) + level[y1 * bw + x1] * tx;
      out[y * width + x] = top * (1 - ty) + bottom * ty;
    }
  }
  return out;
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
    const bg = coarseBackground(data, width, height, included, sigmaPx);
    for (let i = 0; i < data.length; i++) data[i] -= bg[i];
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
