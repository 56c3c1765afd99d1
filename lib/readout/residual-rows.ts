/**
 * The second whole-frame pass (prepare-whole-frame.ts) over a range of rows, as one kernel that
 * either thread can run on its own rows: everything it reads and writes is in typed arrays (in
 * shared memory when a worker thread takes part, lib/parallel/spectrum-threads.ts), and what the
 * pass adds up across rows is kept per row, so the caller adds it in row order whichever thread
 * computed it. The loops are small functions called per row: V8 keeps them optimised, where a
 * long loop in a function called once per readout was compiled on the fly and thrown away at its
 * first exit, every readout.
 */
import { gridRow } from "./coarse-background";
import { addBlockSums, autoResidualRow4, planeResidualRow4, planeRow, residualRow } from "./whole-frame-rows";

/** What the pass writes into `data` as well: nothing, the residual ("auto"), or the pixels less the plane ("plane"). */
export const WRITE_NONE = 0,
  WRITE_RESIDUAL = 1,
  WRITE_PLANE = 2;

export interface ResidualRowsJob {
  /** The stored values, width × height. */
  src: Float32Array;
  width: number;
  height: number;
  /** [c0, c1, c2] of the plane taken from the stored values first ("auto" flattening), or empty. */
  sourcePlane: Float64Array;
  /** The coarse background: its grid rows interpolated along x (bh × width), grid factor, offset. */
  bgRows: Float32Array;
  bgF: number;
  bgBh: number;
  bgOffset: number;
  /** Outlier limits of the stored (float32) residual. */
  upper: number;
  lower: number;
  /** Binning factor of the tissue search (0: none), and the binned residual and intensity (⌊W/tf⌋ × ⌊H/tf⌋). */
  tf: number;
  binnedResidual: Float32Array;
  binnedIntensity: Float32Array;
  /** The flattened copy, width × height, and what is written into it (WRITE_*); the plane written for WRITE_PLANE. */
  data: Float32Array;
  write: number;
  writePlane: Float64Array;
  /** Per row: [Σv, Σv²] of what the row added to the flattened copy (2 × height). */
  rowSums: Float64Array;
}

/**
 * Rows [yFrom, yTo) of the pass; yFrom a multiple of the binning factor. Returns false at the
 * first row whose residual passes an outlier limit (the general path must treat it then).
 */
export function runResidualRows(job: ResidualRowsJob, yFrom: number, yTo: number): boolean {
  const { width, height, tf } = job;
  const line = new Float32Array(width),
    res = new Float32Array(width);
  const w = tf > 0 ? Math.floor(width / tf) : 0,
    h = tf > 0 ? Math.floor(height / tf) : 0;
  const accR = new Float64Array(w),
    accI = new Float64Array(w);
  const extremes = new Float64Array(3),
    planeSums = new Float64Array(2);
  for (let y = yFrom; y < yTo; y++) {
    if (!residualPassRow(job, y, line, res, accR, accI, w, h, extremes, planeSums)) return false;
  }
  return true;
}

/** One row of the pass (see runResidualRows). */
function residualPassRow(
  job: ResidualRowsJob,
  y: number,
  line: Float32Array,
  res: Float32Array,
  accR: Float64Array,
  accI: Float64Array,
  w: number,
  h: number,
  extremes: Float64Array,
  planeSums: Float64Array,
): boolean {
  const { src, width, sourcePlane, bgRows, bgF, bgBh, tf, data, write } = job;
  // The commonest rows, a whole row of blocks of four, in one loop (the same numbers).
  const withPlane = sourcePlane.length === 3;
  if (tf === 4 && width === 4 * w && y < 4 * h && (withPlane ? write === WRITE_RESIDUAL : write === WRITE_PLANE))
    return fusedRow(job, y, accR, accI, w, extremes, planeSums);
  // The stored values are read in place; with the plane first, a row of them less the plane.
  const v = withPlane ? line : src,
    at = withPlane ? 0 : y * width;
  if (withPlane) sourceRowLessPlane(src, y * width, sourcePlane[0] + sourcePlane[2] * y, sourcePlane[1], width, line);
  const { y0, y1, ty } = gridRow(y, bgF, bgBh);
  // With "auto" flattening the residual is the flattened copy: written there, not to a scratch row.
  const toData = write === WRITE_RESIDUAL;
  const out = toData ? data : res,
    outAt = toData ? y * width : 0;
  residualRow(v, at, bgRows, y0 * width, y1 * width, 1 - ty, ty, job.bgOffset, out, outAt, width, extremes);
  // The stored (float32) residual is beyond a limit exactly when its rounded extreme is (rounding is monotone).
  if (Math.fround(extremes[0]) > job.upper || Math.fround(extremes[1]) < job.lower) return false;
  if (toData) {
    job.rowSums[2 * y] = 0;
    job.rowSums[2 * y + 1] = extremes[2];
  } else if (write === WRITE_PLANE) {
    const p = job.writePlane;
    planeRow(src, y * width, data, p[0] + p[2] * y, p[1], width, planeSums);
    job.rowSums[2 * y] = planeSums[0];
    job.rowSums[2 * y + 1] = planeSums[1];
  }
  if (tf > 0 && y < h * tf) {
    addBlockSums(out, outAt, v, at, accR, accI, w, tf);
    if ((y + 1) % tf === 0) storeBlockRow(job, (y + 1) / tf - 1, accR, accI, w, 1 / (tf * tf));
  }
  return true;
}

/**
 * A row of blocks of four (tf = 4, width = 4w) with the residual written ("auto") or the pixels
 * less the plane ("plane"): residualPassRow's steps in one loop (whole-frame-rows.ts).
 */
function fusedRow(
  job: ResidualRowsJob,
  y: number,
  accR: Float64Array,
  accI: Float64Array,
  w: number,
  extremes: Float64Array,
  planeSums: Float64Array,
): boolean {
  const { src, width, sourcePlane, bgRows, data } = job;
  const { y0, y1, ty } = gridRow(y, job.bgF, job.bgBh);
  const row = y * width;
  if (job.write === WRITE_RESIDUAL) {
    const [c0, c1, c2] = sourcePlane;
    autoResidualRow4(
      src,
      row,
      c0 + c2 * y,
      c1,
      bgRows,
      y0 * width,
      y1 * width,
      1 - ty,
      ty,
      job.bgOffset,
      data,
      accR,
      accI,
      w,
      extremes,
    );
  } else {
    const p = job.writePlane;
    planeResidualRow4(
      src,
      row,
      bgRows,
      y0 * width,
      y1 * width,
      1 - ty,
      ty,
      job.bgOffset,
      data,
      p[0] + p[2] * y,
      p[1],
      accR,
      accI,
      w,
      extremes,
      planeSums,
    );
  }
  if (Math.fround(extremes[0]) > job.upper || Math.fround(extremes[1]) < job.lower) return false;
  job.rowSums[2 * y] = job.write === WRITE_RESIDUAL ? 0 : planeSums[0];
  job.rowSums[2 * y + 1] = job.write === WRITE_RESIDUAL ? extremes[2] : planeSums[1];
  if ((y + 1) % 4 === 0) storeBlockRow(job, (y + 1) / 4 - 1, accR, accI, w, 1 / 16);
  return true;
}

/** A row of the stored values less the plane base + c1·x (rounded to float32 as prepareRegion stores it). */
function sourceRowLessPlane(
  src: Float32Array,
  row: number,
  base: number,
  c1: number,
  width: number,
  out: Float32Array,
): void {
  for (let x = 0; x < width; x++) out[x] = src[row + x] - (base + c1 * x);
}

/** A finished row of blocks into the binned grids (binPixels' mean), and the sums cleared for the next. */
function storeBlockRow(
  job: ResidualRowsJob,
  by: number,
  accR: Float64Array,
  accI: Float64Array,
  w: number,
  norm: number,
): void {
  const r = job.binnedResidual,
    b = job.binnedIntensity;
  for (let bx = 0; bx < w; bx++) {
    r[by * w + bx] = accR[bx] * norm;
    b[by * w + bx] = accI[bx] * norm;
  }
  accR.fill(0);
  accI.fill(0);
}
