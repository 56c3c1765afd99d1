/** The per-row loops of prepare-whole-frame.ts (each a small function: see residualRow). */

/**
 * One row of the residual into `res` from `resAt` (each value rounded to float32 as stored); its largest and
 * smallest value before rounding and the sum of squares into `extremes`. A function per row, not a loop in the pass:
 * V8 optimises a small function called thousands of times for good, where a long loop compiled
 * on the fly (on-stack replacement) was thrown back to the baseline compiler at its first exit.
 */
export function residualRow(
  line: Float32Array,
  at: number,
  rows: Float32Array,
  top: number,
  bottom: number,
  uy: number,
  ty: number,
  offset: number,
  res: Float32Array,
  resAt: number,
  width: number,
  extremes: Float64Array,
): void {
  let hi = -Infinity,
    lo = Infinity,
    ss = 0;
  for (let x = 0; x < width; x++) {
    const v = line[at + x] - (rows[top + x] * uy + rows[bottom + x] * ty) - offset;
    res[resAt + x] = v;
    if (v > hi) hi = v;
    if (v < lo) lo = v;
    ss += v * v;
  }
  extremes[0] = hi;
  extremes[1] = lo;
  extremes[2] = ss;
}

/** One row of the stored values less the plane into `data`, as subtractPlane writes it; [Σv, Σv²] of the row into `sums`. */
export function planeRow(
  src: Float32Array,
  row: number,
  data: Float32Array,
  base: number,
  c1: number,
  width: number,
  sums: Float64Array,
): void {
  let rowS = 0,
    rowSs = 0;
  for (let x = 0; x < width; x++) {
    const v = src[row + x] - (base + c1 * x);
    data[row + x] = v;
    rowS += v;
    rowSs += v * v;
  }
  sums[0] = rowS;
  sums[1] = rowSs;
}

/**
 * Adds each block of tf values of `a` (from aAt) and of `b` (from bAt) to its slot (binPixels' order:
 * a sum per block in double from 0, then added to the slot); the common factors 2 and 4 written out.
 */
export function addBlockSums(
  a: Float32Array,
  aAt: number,
  b: Float32Array,
  bAt: number,
  accA: Float64Array,
  accB: Float64Array,
  w: number,
  tf: number,
): void {
  if (tf === 4)
    for (let bx = 0, i = 0; bx < w; bx++, i += 4) {
      const j = aAt + i,
        k = bAt + i;
      accA[bx] += a[j] + a[j + 1] + a[j + 2] + a[j + 3];
      accB[bx] += b[k] + b[k + 1] + b[k + 2] + b[k + 3];
    }
  else if (tf === 2)
    for (let bx = 0, i = 0; bx < w; bx++, i += 2) {
      const j = aAt + i,
        k = bAt + i;
      accA[bx] += a[j] + a[j + 1];
      accB[bx] += b[k] + b[k + 1];
    }
  else
    for (let bx = 0, i = 0; bx < w; bx++) {
      let sa = 0,
        sb = 0;
      for (const end = i + tf; i < end; i++) {
        sa += a[aAt + i];
        sb += b[bAt + i];
      }
      accA[bx] += sa;
      accB[bx] += sb;
    }
}
