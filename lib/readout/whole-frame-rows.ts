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

/**
 * residualRow, planeRow and addBlockSums (tf = 4) of one row in one loop, four pixels at a time,
 * for "plane" flattening: the residual's extremes into `extremes` (its sum of squares is not used
 * there), the pixels less the plane base + c1·x into `data` with their [Σv, Σv²] into `sums`, and
 * `blocks` blocks of four added to accR (the float32 residual) and accI (the stored values). The
 * same operations in the same order as the three loops, so the same numbers
 * (tests/lib/readout/whole-frame-rows.test.ts); the pixels past the last block are left to the
 * caller. About 40 % less time than the three loops on a 4096² frame (tests/bench).
 */
export function planeResidualRow4(
  src: Float32Array,
  row: number,
  rows: Float32Array,
  top: number,
  bottom: number,
  uy: number,
  ty: number,
  offset: number,
  data: Float32Array,
  base: number,
  c1: number,
  accR: Float64Array,
  accI: Float64Array,
  blocks: number,
  extremes: Float64Array,
  sums: Float64Array,
): void {
  const fround = Math.fround;
  let hi = -Infinity,
    lo = Infinity,
    rowS = 0,
    rowSs = 0;
  for (let bx = 0, x = 0; bx < blocks; bx++, x += 4) {
    const i = row + x,
      t = top + x,
      b = bottom + x;
    const s0 = src[i],
      s1 = src[i + 1],
      s2 = src[i + 2],
      s3 = src[i + 3];
    const r0 = s0 - (rows[t] * uy + rows[b] * ty) - offset,
      r1 = s1 - (rows[t + 1] * uy + rows[b + 1] * ty) - offset,
      r2 = s2 - (rows[t + 2] * uy + rows[b + 2] * ty) - offset,
      r3 = s3 - (rows[t + 3] * uy + rows[b + 3] * ty) - offset;
    hi = Math.max(hi, r0, r1, r2, r3);
    lo = Math.min(lo, r0, r1, r2, r3);
    const v0 = s0 - (base + c1 * x),
      v1 = s1 - (base + c1 * (x + 1)),
      v2 = s2 - (base + c1 * (x + 2)),
      v3 = s3 - (base + c1 * (x + 3));
    data[i] = v0;
    data[i + 1] = v1;
    data[i + 2] = v2;
    data[i + 3] = v3;
    rowS = rowS + v0 + v1 + v2 + v3;
    rowSs = rowSs + v0 * v0 + v1 * v1 + v2 * v2 + v3 * v3;
    accR[bx] += fround(r0) + fround(r1) + fround(r2) + fround(r3);
    accI[bx] += s0 + s1 + s2 + s3;
  }
  extremes[0] = hi;
  extremes[1] = lo;
  sums[0] = rowS;
  sums[1] = rowSs;
}

/**
 * The same for "auto" flattening (tf = 4): the stored values less the plane taken from them first,
 * sbase + sc1·x, rounded to float32 (as the row of them is stored); the residual written into
 * `data` from `row`, its extremes and sum of squares into `extremes`; `blocks` blocks of four
 * added to accR (the float32 residual) and accI (the rounded values less the plane).
 */
export function autoResidualRow4(
  src: Float32Array,
  row: number,
  sbase: number,
  sc1: number,
  rows: Float32Array,
  top: number,
  bottom: number,
  uy: number,
  ty: number,
  offset: number,
  data: Float32Array,
  accR: Float64Array,
  accI: Float64Array,
  blocks: number,
  extremes: Float64Array,
): void {
  const fround = Math.fround;
  let hi = -Infinity,
    lo = Infinity,
    ss = 0;
  for (let bx = 0, x = 0; bx < blocks; bx++, x += 4) {
    const i = row + x,
      t = top + x,
      b = bottom + x;
    const v0 = fround(src[i] - (sbase + sc1 * x)),
      v1 = fround(src[i + 1] - (sbase + sc1 * (x + 1))),
      v2 = fround(src[i + 2] - (sbase + sc1 * (x + 2))),
      v3 = fround(src[i + 3] - (sbase + sc1 * (x + 3)));
    const r0 = v0 - (rows[t] * uy + rows[b] * ty) - offset,
      r1 = v1 - (rows[t + 1] * uy + rows[b + 1] * ty) - offset,
      r2 = v2 - (rows[t + 2] * uy + rows[b + 2] * ty) - offset,
      r3 = v3 - (rows[t + 3] * uy + rows[b + 3] * ty) - offset;
    data[i] = r0;
    data[i + 1] = r1;
    data[i + 2] = r2;
    data[i + 3] = r3;
    hi = Math.max(hi, r0, r1, r2, r3);
    lo = Math.min(lo, r0, r1, r2, r3);
    ss = ss + r0 * r0 + r1 * r1 + r2 * r2 + r3 * r3;
    accR[bx] += fround(r0) + fround(r1) + fround(r2) + fround(r3);
    accI[bx] += v0 + v1 + v2 + v3;
  }
  extremes[0] = hi;
  extremes[1] = lo;
  extremes[2] = ss;
}
