import { DctPlan } from "../fft";
import type { Grid } from "./grid";

/**
 * An eigenbasis of the Laplacian on a grid: forward maps a real field to its coefficients,
 * inverse maps back; `k2PerUm2[j]` is the eigenvalue k² (1/µm²) of coefficient j.
 */
export interface SpectralBasis {
  readonly grid: Grid;
  readonly k2PerUm2: Float64Array;
  /** src (real, length cellCount) → dst (coefficients). src is left unchanged; src ≠ dst in 2-D. */
  forward(src: Float64Array, dst: Float64Array): void;
  /** src (coefficients) → dst (real). src is left unchanged. */
  inverse(src: Float64Array, dst: Float64Array): void;
}

/**
 * The zero-flux (Neumann) basis: cosine coefficients with k = mπ/L per axis (SCIENCE.md §2).
 * 2-D coefficient layout is transposed, index = kx·ny + ky: the second pass of each direction
 * reads two columns of the first pass's output at a time (no separate transpose), and
 * diffusion only multiplies pointwise, so the inverse undoes the transposed layout. Axis sizes
 * are even (powers of two ≥ 4), so columns always come in pairs. One DCT plan per axis size.
 */
export function createCosineBasis(grid: Grid): SpectralBasis {
  const { nx, ny } = grid;
  const px = new DctPlan(nx);
  const k2 = new Float64Array(grid.cellCount);
  const kx2 = Float64Array.from({ length: nx }, (_, m) => ((m * Math.PI) / grid.lengthXUm) ** 2);
  if (grid.dimensions === 1) {
    k2.set(kx2);
    return {
      grid,
      k2PerUm2: k2,
      forward: (src, dst) => px.forwardRows(src, dst, 1),
      inverse: (src, dst) => px.inverseRows(src, dst, 1),
    };
  }
  const py = ny === nx ? px : new DctPlan(ny);
  const ky2 = Float64Array.from({ length: ny }, (_, m) => ((m * Math.PI) / grid.lengthYUm) ** 2);
  for (let a = 0; a < nx; a++) for (let b = 0; b < ny; b++) k2[a * ny + b] = kx2[a] + ky2[b];
  const scratch = new Float64Array(grid.cellCount);
  return {
    grid,
    k2PerUm2: k2,
    forward(src, dst) {
      px.forwardRows(src, scratch, ny); // along x: scratch[iy][kx]
      // Along y, reading two columns of scratch at a time; writes dst[kx][ky] row by row.
      for (let kx = 0; kx < nx; kx += 2) py.forwardColumnPair(scratch, nx, kx, dst, kx * ny, (kx + 1) * ny);
    },
    inverse(src, dst) {
      py.inverseRows(src, scratch, nx); // along y: scratch[kx][iy]
      // Along x, reading two columns of scratch at a time; writes dst[iy][ix] row by row.
      for (let iy = 0; iy < ny; iy += 2) px.inverseColumnPair(scratch, ny, iy, dst, iy * nx, (iy + 1) * nx);
    },
  };
}

const BLOCK = 16;

/** dst[c·rows + r] = src[r·cols + c], cache-blocked. */
export function transpose(src: Float64Array, dst: Float64Array, rows: number, cols: number): void {
  for (let r0 = 0; r0 < rows; r0 += BLOCK) {
    const r1 = Math.min(rows, r0 + BLOCK);
    for (let c0 = 0; c0 < cols; c0 += BLOCK) {
      const c1 = Math.min(cols, c0 + BLOCK);
      for (let r = r0; r < r1; r++) {
        const base = r * cols;
        for (let c = c0; c < c1; c++) dst[c * rows + r] = src[base + c];
      }
    }
  }
}
