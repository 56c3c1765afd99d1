import { blur } from "./box-blur";

/** Above this σ (px) the background is computed on a grid binned by ⌊σ/8⌋ and interpolated back. */
export const COARSE_SIGMA_PX = 24;

/** The grid's cell side (px) for a background of SD σ. */
export function coarseFactor(sigmaPx: number): number {
  return Math.max(2, Math.floor(sigmaPx / 8));
}

/** Per-cell sums and pixel counts of a region on the grid of cell side f (the background's input). */
export interface CoarseSums {
  f: number;
  bw: number;
  bh: number;
  sum: Float32Array;
  count: Float32Array;
}

/** Empty grid sums for a width × height region. */
export function emptyCoarseSums(width: number, height: number, f: number): CoarseSums {
  const bw = Math.ceil(width / f),
    bh = Math.ceil(height / f);
  return { f, bw, bh, sum: new Float32Array(bw * bh), count: new Float32Array(bw * bh) };
}

/**
 * Adds one row of every pixel analysed (no mask) to the grid sums: a sum per cell in double,
 * then added to the cell. Whoever reads the rows anyway (the pass that takes the region's
 * statistics) calls this, so the same sums need no pass of their own.
 */
export function addCoarseRow(g: CoarseSums, data: Float32Array, row: number, y: number, width: number): void {
  const { f, bw, sum, count } = g;
  const brow = ((y / f) | 0) * bw;
  for (let bx = 0; bx < bw; bx++) {
    const x1 = Math.min(width, (bx + 1) * f);
    let s = 0;
    for (let x = bx * f; x < x1; x++) s += data[row + x];
    sum[brow + bx] += s;
    count[brow + bx] += x1 - bx * f;
  }
}

function binCoarse(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  f: number,
): CoarseSums {
  const g = emptyCoarseSums(width, height, f);
  const { bw, sum, count } = g;
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
    } else addCoarseRow(g, data, row, y, width);
  }
  return g;
}

/**
 * The background interpolated along x for every grid row (bh × width): each pixel's background
 * is then a blend of two of these rows (see `gridRow`). `offset` is the mean of data − background
 * when asked for (no mask), else 0.
 */
export interface CoarseBackground {
  f: number;
  bh: number;
  rows: Float32Array;
  offset: number;
}

/** The normalised Gaussian background from the grid sums, interpolated along x (see subtractCoarseBackground). */
export function interpolateCoarseBackground(
  g: CoarseSums,
  width: number,
  height: number,
  sigmaPx: number,
  centring: boolean,
): CoarseBackground {
  const { f, bw, bh, sum, count } = g;
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
  return { f, bh, rows, offset };
}

/**
 * The normalised Gaussian background on a grid binned by f, bilinearly interpolated back to every
 * pixel and subtracted (`into` = data − background, may be `data` itself). A background of σ ≥ 24 px
 * varies little over f ≤ σ/8 px, so the error is far below the pattern's, and a 4096² frame needs a
 * blur of 512² instead of 4096². The grid rows are first interpolated along x once (bh × width), so
 * each pixel costs two reads and a blend: one pass to bin and one to subtract.
 */
export function subtractCoarseBackground(
  data: Float32Array,
  into: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  sigmaPx: number,
  centre = false,
): number | null {
  const g = binCoarse(data, width, height, included, coarseFactor(sigmaPx));
  const centring = centre && !included;
  const { f, bh, rows, offset } = interpolateCoarseBackground(g, width, height, sigmaPx, centring);
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
export function gridRow(y: number, f: number, bh: number): { y0: number; y1: number; ty: number } {
  const gy = Math.min(bh - 1, Math.max(0, (y + 0.5) / f - 0.5));
  const y0 = Math.floor(gy);
  return { y0, y1: Math.min(bh - 1, y0 + 1), ty: gy - y0 };
}
