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
  // [min, max, atMin, atMax, row Σz, row Σx·z], carried from row to row.
  const state = new Float64Array([Infinity, -Infinity, 0, 0, 0, 0]);
  let sumZ = 0,
    sumXZ = 0,
    sumYZ = 0;
  for (let y = 0; y < height; y++) {
    statsRow(src, y * width, width, grid, grid ? ((y / grid.f) | 0) * grid.bw : 0, state);
    const rz = state[4];
    sumZ += rz;
    sumXZ += state[5];
    sumYZ += y * rz;
  }
  return { min: state[0], max: state[1], atMin: state[2], atMax: state[3], sumZ, sumXZ, sumYZ };
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
