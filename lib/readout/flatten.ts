/**
 * How the slow background is removed before the FFT. "auto": a least-squares plane, then a
 * Gaussian background (σ = shorter side/8) subtracted inside the analysed pixels only.
 */
export type FlattenMethod = "auto" | "plane" | "blur" | "none";

/**
 * Least-squares plane z = c₀ + c₁x + c₂y over the included pixels, subtracted in place
 * (normal equations, 3×3, solved by Cramer's rule). Without a mask, returns the residual's SD
 * (n − 1) when its mean is zero to rounding, so the caller can skip subtractMean; else null.
 */
export function subtractPlane(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sums?: { sumZ: number; sumXZ: number; sumYZ: number },
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
    // Sums taken by the pass that copied the region (extractRoi's stats) spare this one.
    if (sums) ({ sumZ: sz, sumXZ: sxz, sumYZ: syz } = sums);
    else
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
  if (!(Math.abs(d) > 1e-9 * Math.max(1, n) ** 3)) return subtractMean(data, included);
  const c0 = det3([sz, sx, sy, sxz, sxx, sxy, syz, sxy, syy]) / d;
  const c1 = det3([n, sz, sy, sx, sxz, sxy, sy, syz, syy]) / d;
  const c2 = det3([n, sx, sz, sx, sxx, sxz, sy, sxy, syz]) / d;
  let s = 0,
    ss = 0;
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const base = c0 + c2 * y;
    let rowS = 0,
      rowSs = 0;
    for (let x = 0; x < width; x++) {
      const v = (data[row + x] -= base + c1 * x);
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
    // The box is whole for r ≤ k < len − r − 1: no clamping there.
    const innerFrom = Math.min(len, r),
      innerTo = Math.max(innerFrom, len - r - 1),
      full = 2 * r + 1;
    for (let k = 0; k < innerFrom; k++) {
      const lo = k - r,
        hi = k + r;
      dst[base + k * step] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
      if (hi + 1 < len) acc += src[base + (hi + 1) * step];
      if (lo >= 0) acc -= src[base + lo * step];
    }
    for (let k = innerFrom; k < innerTo; k++) {
      dst[base + k * step] = acc / full;
      acc += src[base + (k + r + 1) * step];
      acc -= src[base + (k - r) * step];
    }
    for (let k = innerTo; k < len; k++) {
      const lo = k - r,
        hi = k + r;
      dst[base + k * step] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
      if (hi + 1 < len) acc += src[base + (hi + 1) * step];
      if (lo >= 0) acc -= src[base + lo * step];
    }
  }
}

/**
 * One running-box pass of half-width r down the columns, all columns at once: rows are read
 * whole and in order (a column at a time would read one value per cache line), the same sums as
 * boxPass with stride `width`.
 */
function boxPassColumns(src: Float32Array, dst: Float32Array, width: number, height: number, r: number): void {
  const acc = new Float64Array(width);
  for (let k = 0; k <= Math.min(r, height - 1); k++) {
    const row = k * width;
    for (let x = 0; x < width; x++) acc[x] += src[row + x];
  }
  for (let k = 0; k < height; k++) {
    const lo = k - r,
      hi = k + r;
    const n = Math.min(hi, height - 1) - Math.max(lo, 0) + 1;
    const out = k * width;
    for (let x = 0; x < width; x++) dst[out + x] = acc[x] / n;
    if (hi + 1 < height) {
      const add = (hi + 1) * width;
      for (let x = 0; x < width; x++) acc[x] += src[add + x];
    }
    if (lo >= 0) {
      const sub = lo * width;
      for (let x = 0; x < width; x++) acc[x] -= src[sub + x];
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
    boxPassColumns(a, b, width, height, r);
    [a, b] = [b, a];
  }
  return a;
}

/** Above this σ (px) the background is computed on a grid binned by ⌊σ/8⌋ and interpolated back. */
const COARSE_SIGMA_PX = 24;

/**
 * The normalised Gaussian background on a grid binned by f, bilinearly interpolated back to every
 * pixel and subtracted (`into` = data − background, may be `data` itself). A background of σ ≥ 24 px
 * varies little over f ≤ σ/8 px, so the error is far below the pattern's, and a 4096² frame needs a
 * blur of 512² instead of 4096². The grid rows are first interpolated along x once (bh × width), so
 * each pixel costs two reads and a blend: one pass to bin and one to subtract.
 */
function subtractCoarseBackground(
  data: Float32Array,
  into: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sigmaPx: number,
  centre = false,
): number | null {
  const f = Math.max(2, Math.floor(sigmaPx / 8));
  const bw = Math.ceil(width / f),
    bh = Math.ceil(height / f);
  const sum = new Float32Array(bw * bh),
    count = new Float32Array(bw * bh);
  const cell = new Int32Array(width);
  for (let x = 0; x < width; x++) cell[x] = (x / f) | 0;
  for (let y = 0; y < height; y++) {
    const brow = ((y / f) | 0) * bw,
      row = y * width;
    if (included) {
      for (let x = 0; x < width; x++)
        if (included[row + x]) {
          sum[brow + cell[x]] += data[row + x];
          count[brow + cell[x]]++;
        }
    } else
      for (let bx = 0; bx < bw; bx++) {
        const x1 = Math.min(width, (bx + 1) * f);
        let s = 0;
        for (let x = bx * f; x < x1; x++) s += data[row + x];
        sum[brow + bx] += s;
        count[brow + bx] += x1 - bx * f;
      }
  }
  const num = blur(sum, bw, bh, sigmaPx / f),
    den = blur(count, bw, bh, sigmaPx / f);
  const level = Float32Array.from(num, (v, j) => (den[j] > 1e-6 ? v / den[j] : 0));
  // Each grid row interpolated along x to every column.
  const x0s = new Int32Array(width),
    x1s = new Int32Array(width),
    txs = new Float32Array(width);
  for (let x = 0; x < width; x++) {
    const gx = Math.min(bw - 1, Math.max(0, (x + 0.5) / f - 0.5));
    x0s[x] = Math.floor(gx);
    x1s[x] = Math.min(bw - 1, x0s[x] + 1);
    txs[x] = gx - x0s[x];
  }
  const rows = new Float32Array(bh * width);
  for (let gy = 0; gy < bh; gy++)
    for (let x = 0; x < width; x++) {
      const a = level[gy * bw + x0s[x]],
        b = level[gy * bw + x1s[x]];
      rows[gy * width + x] = a * (1 - txs[x]) + b * txs[x];
    }
  // Without a mask the residual's mean is known before the pass (the data's from the bins, the
  // background's from the interpolated rows), so the pass can centre it and sum its squares too.
  let offset = 0;
  const centring = centre && !included;
  if (centring) {
    const rowMean = new Float64Array(bh);
    for (let gy = 0; gy < bh; gy++) {
      let m = 0;
      for (let x = 0; x < width; x++) m += rows[gy * width + x];
      rowMean[gy] = m / width;
    }
    let dataSum = 0,
      bgSum = 0;
    for (let j = 0; j < sum.length; j++) dataSum += sum[j];
    for (let y = 0; y < height; y++) {
      const { y0, y1, ty } = gridRow(y, f, bh);
      bgSum += rowMean[y0] * (1 - ty) + rowMean[y1] * ty;
    }
    offset = dataSum / (width * height) - bgSum / height;
  }
  let ss = 0;
  for (let y = 0; y < height; y++) {
    const { y0, y1, ty } = gridRow(y, f, bh);
    const uy = 1 - ty;
    const top = y0 * width,
      bottom = y1 * width,
      row = y * width;
    if (!centring)
      for (let x = 0; x < width; x++) into[row + x] = data[row + x] - (rows[top + x] * uy + rows[bottom + x] * ty);
    else {
      let rowSs = 0;
      for (let x = 0; x < width; x++) {
        const v = data[row + x] - (rows[top + x] * uy + rows[bottom + x] * ty) - offset;
        into[row + x] = v;
        rowSs += v * v;
      }
      ss += rowSs;
    }
  }
  const n = width * height;
  return centring ? (n > 1 ? Math.sqrt(ss / (n - 1)) : 0) : null;
}

/** The two grid rows around image row y and the weight of the second (bilinear, clamped at the border). */
function gridRow(y: number, f: number, bh: number): { y0: number; y1: number; ty: number } {
  const gy = Math.min(bh - 1, Math.max(0, (y + 0.5) / f - 0.5));
  const y0 = Math.floor(gy);
  return { y0, y1: Math.min(bh - 1, y0 + 1), ty: gy - y0 };
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
