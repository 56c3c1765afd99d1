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
  let min = Infinity,
    max = -Infinity,
    atMin = 0,
    atMax = 0,
    sumZ = 0,
    sumXZ = 0,
    sumYZ = 0;
  for (let y = 0; y < height; y++) {
    const from = y * width;
    let rz = 0,
      rxz = 0;
    const f = grid ? grid.f : width,
      cells = grid ? grid.bw : 1,
      brow = grid ? ((y / f) | 0) * cells : 0;
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
    sumZ += rz;
    sumXZ += rxz;
    sumYZ += y * rz;
  }
  return { min, max, atMin, atMax, sumZ, sumXZ, sumYZ };
}
