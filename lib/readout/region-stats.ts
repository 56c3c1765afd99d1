import type { RegionStats } from "./roi";

export type { RegionStats };

/**
 * The RegionStats of a whole width × height image, read without copying it (the same sums in the
 * same order as extractRoi's copying pass). `eachRow(row, y)`, when given, is called after each
 * row is read, so another sum over the rows can ride on the same pass while the row is in cache.
 */
export function takeRegionStats(
  src: Float32Array,
  width: number,
  height: number,
  eachRow: ((row: number, y: number) => void) | null,
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
    for (let x = 0; x < width; x++) {
      const v = src[from + x];
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
    sumZ += rz;
    sumXZ += rxz;
    sumYZ += y * rz;
    eachRow?.(from, y);
  }
  return { min, max, atMin, atMax, sumZ, sumXZ, sumYZ };
}
