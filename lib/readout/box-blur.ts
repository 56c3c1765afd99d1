import { currentSpectrumExecutor, MIN_PARALLEL_BINS } from "../fft";
import { reusedFloat32 } from "./reused-buffer";

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
function boxPassColumns(
  src: Float32Array,
  dst: Float32Array,
  width: number,
  height: number,
  r: number,
  x0 = 0,
  x1 = width,
): void {
  // Columns [x0, x1) only (a thread's share): acc[i] is column x0 + i.
  const acc = new Float64Array(x1 - x0);
  for (let k = 0; k <= Math.min(r, height - 1); k++) {
    const row = k * width + x0;
    for (let x = 0; x < x1 - x0; x++) acc[x] += src[row + x];
  }
  for (let k = 0; k < height; k++) {
    const lo = k - r,
      hi = k + r;
    const n = Math.min(hi, height - 1) - Math.max(lo, 0) + 1;
    const out = k * width + x0;
    const m = x1 - x0;
    if (hi + 1 < height && lo >= 0) {
      // Inside the column the three steps in one loop, each column's sum in the same order.
      const add = (hi + 1) * width + x0,
        sub = lo * width + x0;
      for (let x = 0; x < m; x++) {
        let v = acc[x];
        dst[out + x] = v / n;
        v += src[add + x];
        v -= src[sub + x];
        acc[x] = v;
      }
      continue;
    }
    for (let x = 0; x < m; x++) dst[out + x] = acc[x] / n;
    if (hi + 1 < height) {
      const add = (hi + 1) * width + x0;
      for (let x = 0; x < m; x++) acc[x] += src[add + x];
    }
    if (lo >= 0) {
      const sub = lo * width + x0;
      for (let x = 0; x < m; x++) acc[x] -= src[sub + x];
    }
  }
}

/** The start of a row's running box (boxPass with step 1): the first sum and the clamped head; returns the sum. */
function rowHead(
  src: Float32Array,
  dst: Float32Array,
  base: number,
  len: number,
  r: number,
  innerFrom: number,
): number {
  let acc = 0;
  for (let k = 0; k <= Math.min(r, len - 1); k++) acc += src[base + k];
  for (let k = 0; k < innerFrom; k++) {
    const lo = k - r,
      hi = k + r;
    dst[base + k] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
    if (hi + 1 < len) acc += src[base + hi + 1];
    if (lo >= 0) acc -= src[base + lo];
  }
  return acc;
}

/** The clamped end of a row's running box, from its sum after the whole boxes. */
function rowTail(
  src: Float32Array,
  dst: Float32Array,
  base: number,
  len: number,
  r: number,
  innerTo: number,
  acc: number,
): void {
  for (let k = innerTo; k < len; k++) {
    const lo = k - r,
      hi = k + r;
    dst[base + k] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
    if (hi + 1 < len) acc += src[base + hi + 1];
    if (lo >= 0) acc -= src[base + lo];
  }
}

/**
 * boxPass along rows, four rows at a time through the whole boxes: each row's running sum is a
 * chain of dependent additions, and four independent chains keep the processor busy where one
 * waits on each addition. Every row's sums are the same, in the same order, as boxPass's.
 */
function boxPassRows(src: Float32Array, dst: Float32Array, width: number, height: number, r: number): void {
  const innerFrom = Math.min(width, r),
    innerTo = Math.max(innerFrom, width - r - 1),
    full = 2 * r + 1;
  let line = 0;
  for (; line + 4 <= height; line += 4) {
    const b0 = line * width,
      b1 = b0 + width,
      b2 = b1 + width,
      b3 = b2 + width;
    let a0 = rowHead(src, dst, b0, width, r, innerFrom),
      a1 = rowHead(src, dst, b1, width, r, innerFrom),
      a2 = rowHead(src, dst, b2, width, r, innerFrom),
      a3 = rowHead(src, dst, b3, width, r, innerFrom);
    for (let k = innerFrom; k < innerTo; k++) {
      const add = k + r + 1,
        sub = k - r;
      dst[b0 + k] = a0 / full;
      dst[b1 + k] = a1 / full;
      dst[b2 + k] = a2 / full;
      dst[b3 + k] = a3 / full;
      a0 += src[b0 + add];
      a1 += src[b1 + add];
      a2 += src[b2 + add];
      a3 += src[b3 + add];
      a0 -= src[b0 + sub];
      a1 -= src[b1 + sub];
      a2 -= src[b2 + sub];
      a3 -= src[b3 + sub];
    }
    rowTail(src, dst, b0, width, r, innerTo, a0);
    rowTail(src, dst, b1, width, r, innerTo, a1);
    rowTail(src, dst, b2, width, r, innerTo, a2);
    rowTail(src, dst, b3, width, r, innerTo, a3);
  }
  if (line < height) boxPass(src.subarray(line * width), dst.subarray(line * width), width, height - line, 1, width, r);
}

/** The half-width r of blur's boxes for a Gaussian of SD σ: 3 boxes of width 2r+1 have σ² = 3·((2r+1)²−1)/12 ≈ r². */
export const boxHalfWidth = (sigmaPx: number) => Math.max(1, Math.round(Math.sqrt(sigmaPx * sigmaPx + 1) - 0.5));

/**
 * The weights of blur's three box passes along one axis of `len` pixels: for output position p,
 * weights[p·(6r+1) + j] is the weight of input p − 3r + j (0 outside the line). Each pass is the
 * mean over the part of [k − r, k + r] inside the line, as boxPass; interior positions share one
 * kernel, the 3r positions at each end get their own.
 */
export function boxBlurWeights(len: number, r: number): Float64Array {
  const reach = 3 * r,
    span = 2 * reach + 1;
  const weights = new Float64Array(len * span);
  const count = (k: number) => Math.min(k + r, len - 1) - Math.max(k - r, 0) + 1;
  // One pass of an impulse response restricted to [from, to], from the previous pass's values on [from − r, to + r].
  const pass = (prev: Float64Array, prevFrom: number, from: number, to: number) => {
    const out = new Float64Array(to - from + 1);
    for (let k = from; k <= to; k++) {
      let acc = 0;
      for (let q = Math.max(k - r, 0, prevFrom); q <= Math.min(k + r, len - 1, prevFrom + prev.length - 1); q++)
        acc += prev[q - prevFrom];
      out[k - from] = acc / count(k);
    }
    return out;
  };
  let interior: Float64Array | null = null;
  for (let p = 0; p < len; p++) {
    const edge = p < reach || p > len - 1 - reach;
    if (!edge && interior) {
      weights.set(interior, p * span);
      continue;
    }
    const kernel = new Float64Array(span);
    for (let j = 0; j < span; j++) {
      const q = p - reach + j;
      if (q < 0 || q >= len) continue;
      const impulse = new Float64Array([1]);
      const a = pass(impulse, q, Math.max(0, p - 2 * r), Math.min(len - 1, p + 2 * r));
      const b = pass(a, Math.max(0, p - 2 * r), Math.max(0, p - r), Math.min(len - 1, p + r));
      kernel[j] = pass(b, Math.max(0, p - r), p, p)[0];
    }
    weights.set(kernel, p * span);
    if (!edge) interior = kernel;
  }
  return weights;
}

/**
 * Three box passes per axis approximate a Gaussian of SD σ (Wells 1986, IEEE PAMI 8:234). With a
 * second thread (SpectrumExecutor.splitRows) and at least 2²⁰ px, each pass is split: the rows'
 * passes by rows, the columns' by columns; every row and column is the same sums either way.
 */
export function blur(data: Float32Array, width: number, height: number, sigmaPx: number, reuse?: string): Float32Array {
  const r = boxHalfWidth(sigmaPx);
  const executor = currentSpectrumExecutor();
  const split = executor?.splitRows && width * height >= MIN_PARALLEL_BINS && width >= 2 && height >= 2;
  // With `reuse`, the two working arrays are reusedFloat32's slots `reuse`-a and -b (their page
  // faults once, not every readout): the result is then one of them, kept only by a caller that
  // keeps nothing of it after its own synchronous call.
  const n = data.length;
  let a = reuse ? reusedFloat32(`${reuse}-a`, n) : split ? new Float32Array(new SharedArrayBuffer(4 * n)) : null;
  let b = reuse ? reusedFloat32(`${reuse}-b`, n) : split ? new Float32Array(new SharedArrayBuffer(4 * n)) : null;
  if (a) a.set(data);
  else a = Float32Array.from(data);
  b ??= new Float32Array(n);
  for (let p = 0; p < 3; p++) {
    const job: BoxJob = { src: a, dst: b, width, height, r };
    const rowAt = height >> 1;
    if (!split || executor.splitRows!("box-rows", job, rowAt, height, () => runBoxRows(job, 0, rowAt)) === null)
      boxPassRows(a, b, width, height, r);
    [a, b] = [b, a];
    const columns: BoxJob = { src: a, dst: b, width, height, r };
    const columnAt = width >> 1;
    if (
      !split ||
      executor.splitRows!("box-columns", columns, columnAt, width, () => runBoxColumns(columns, 0, columnAt)) === null
    )
      boxPassColumns(a, b, width, height, r);
    [a, b] = [b, a];
  }
  return a;
}

/** One box pass of a blur as a row kernel (SpectrumExecutor.splitRows). */
export interface BoxJob {
  src: Float32Array;
  dst: Float32Array;
  width: number;
  height: number;
  r: number;
}

/** Rows [from, to) of a box pass along the rows. */
export function runBoxRows({ src, dst, width, r }: BoxJob, from: number, to: number): boolean {
  boxPassRows(src.subarray(from * width, to * width), dst.subarray(from * width, to * width), width, to - from, r);
  return true;
}

/** Columns [from, to) of a box pass down the columns. */
export function runBoxColumns({ src, dst, width, height, r }: BoxJob, from: number, to: number): boolean {
  boxPassColumns(src, dst, width, height, r, from, to);
  return true;
}
