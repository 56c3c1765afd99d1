import { currentSpectrumExecutor, MIN_PARALLEL_BINS } from "../fft";
import type { CoarseSums } from "./coarse-background";
import type { RegionStats } from "./roi";

export type { RegionStats };

/**
 * The RegionStats of a whole width × height image, read without copying it (the same sums in the
 * same order as extractRoi's copying pass). With `grid`, the background's grid sums ride on the
 * same pass (addCoarseRow's sums, in its order), so the pixels are read once for both.
 */
export function takeRegionStats(
  src: Float32Array,
  width: number,
  height: number,
  grid: CoarseSums | null,
): RegionStats {
  // With a second thread (the pixels in shared memory, as the TIFF reader leaves them) it takes the lower rows,
  // from a whole row of grid cells on; the grid sums are then written to shared copies.
  const executor = currentSpectrumExecutor();
  const split = executor?.splitRows && src.buffer instanceof SharedArrayBuffer && width * height >= MIN_PARALLEL_BINS;
  const shared = (a: Float32Array) => {
    const b = new Float32Array(new SharedArrayBuffer(4 * a.length));
    b.set(a);
    return b;
  };
  const job: RegionStatsJob = {
    src,
    width,
    grid: grid && split ? { ...grid, sum: shared(grid.sum), count: shared(grid.count) } : grid,
    extremes: split ? new Float64Array(new SharedArrayBuffer(8 * 8)) : new Float64Array(8),
    rowSums: split ? new Float64Array(new SharedArrayBuffer(16 * height)) : new Float64Array(2 * height),
  };
  job.extremes.set([Infinity, -Infinity, 0, 0, Infinity, -Infinity, 0, 0]);
  const f = grid ? grid.f : 1;
  const at = f * Math.round(height / 2 / f);
  const both = split
    ? executor.splitRows!("region-stats", job, at, height, () => runRegionStatsRows(job, 0, at))
    : null;
  if (both === null) runRegionStatsRows(job, 0, height);
  if (grid && job.grid !== grid) {
    grid.sum.set(job.grid!.sum);
    grid.count.set(job.grid!.count);
  }
  // The parts' extremes joined (a count is of the values equal to the extreme, so the counts of equal extremes add).
  const e = job.extremes;
  const lowest = Math.min(e[0], e[4]),
    highest = Math.max(e[1], e[5]);
  const atMin = (e[0] === lowest ? e[2] : 0) + (e[4] === lowest ? e[6] : 0),
    atMax = (e[1] === highest ? e[3] : 0) + (e[5] === highest ? e[7] : 0);
  // The row sums added in row order, as one pass over the rows adds them.
  let sumZ = 0,
    sumXZ = 0,
    sumYZ = 0;
  for (let y = 0; y < height; y++) {
    const rz = job.rowSums[2 * y];
    sumZ += rz;
    sumXZ += job.rowSums[2 * y + 1];
    sumYZ += y * rz;
  }
  return { min: lowest, max: highest, atMin, atMax, sumZ, sumXZ, sumYZ };
}

/** takeRegionStats' pass as a row kernel either thread runs on its rows (SpectrumExecutor.splitRows). */
export interface RegionStatsJob {
  src: Float32Array;
  width: number;
  grid: CoarseSums | null;
  /** [min, max, atMin, atMax] of the part from row 0, then of the other part (±∞ and 0 until written). */
  extremes: Float64Array;
  /** Per row: [Σz, Σx·z]. */
  rowSums: Float64Array;
}

/** Rows [from, to) of takeRegionStats' pass (from a multiple of the grid's cell side). */
export function runRegionStatsRows(job: RegionStatsJob, from: number, to: number): boolean {
  const { src, width, grid, rowSums } = job;
  // [min, max, atMin, atMax, row Σz, row Σx·z], carried from row to row.
  const state = new Float64Array([Infinity, -Infinity, 0, 0, 0, 0]);
  for (let y = from; y < to; y++) {
    statsRow(src, y * width, width, grid, grid ? ((y / grid.f) | 0) * grid.bw : 0, state);
    rowSums[2 * y] = state[4];
    rowSums[2 * y + 1] = state[5];
  }
  job.extremes.set(state.subarray(0, 4), from === 0 ? 0 : 4);
  return true;
}

/**
 * One row of takeRegionStats. A function per row, not a loop inside the pass: V8 optimises a
 * small function called thousands of times for good, where a long loop compiled on the fly
 * (on-stack replacement) was thrown back to the baseline compiler at its first exit.
 */
function statsRow(
  src: Float32Array,
  from: number,
  width: number,
  grid: CoarseSums | null,
  brow: number,
  state: Float64Array,
): void {
  let min = state[0],
    max = state[1],
    atMin = state[2],
    atMax = state[3],
    rz = 0,
    rxz = 0;
  const f = grid ? grid.f : width,
    cells = grid ? grid.bw : 1;
  for (let bx = 0; bx < cells; bx++) {
    const x1 = Math.min(width, (bx + 1) * f);
    let s = 0;
    for (let x = bx * f; x < x1; x++) {
      const v = src[from + x];
      s += v;
      // Written so, the counts compile to plain branches (a conditional expression made this loop 4× slower).
      if (v >= max) {
        if (v > max) {
          max = v;
          atMax = 0;
        }
        atMax++;
      }
      if (v <= min) {
        if (v < min) {
          min = v;
          atMin = 0;
        }
        atMin++;
      }
      rz += v;
      rxz += x * v;
    }
    if (grid) {
      grid.sum[brow + bx] += s;
      grid.count[brow + bx] += x1 - bx * f;
    }
  }
  state[0] = min;
  state[1] = max;
  state[2] = atMin;
  state[3] = atMax;
  state[4] = rz;
  state[5] = rxz;
}
