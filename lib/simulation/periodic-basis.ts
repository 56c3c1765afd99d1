import { transpose, type SpectralBasis } from "./cosine-basis";
import type { Grid } from "./grid";
import { RealFftPlan, halfComplexFrequency } from "../fft";

/**
 * Fourier basis of a periodic interval or rectangle, k = 2πj/L per axis, stored in a real
 * layout of exactly cellCount numbers: rows are half-complex along x (lib/fft/real-fft-plan.ts); in 2-D,
 * after a transpose, the two real rows (x-frequencies 0 and N/2) are half-complex along y and
 * each pair of rows (Re, Im of x-frequency j) holds a complex FFT along y. Diffusion multipliers
 * depend on k² only, so they act on every stored number alike.
 */
export function createPeriodicBasis(grid: Grid): SpectralBasis {
  const { nx, ny } = grid;
  const px = new RealFftPlan(nx);
  const kx = (slot: number) => (2 * Math.PI * halfComplexFrequency(slot, nx)) / grid.lengthXUm;
  const k2 = new Float64Array(grid.cellCount);
  if (grid.dimensions === 1) {
    for (let s = 0; s < nx; s++) k2[s] = kx(s) ** 2;
    return {
      grid,
      k2PerUm2: k2,
      forward: (a, b) => px.forwardRows(a, b, 1),
      inverse: (a, b) => px.inverseRows(a, b, 1),
    };
  }
  const py = ny === nx ? px : new RealFftPlan(ny);
  for (let r = 0; r < nx; r++) {
    for (let q = 0; q < ny; q++) {
      const j = r < 2 ? halfComplexFrequency(q, ny) : q <= ny / 2 ? q : ny - q;
      k2[r * ny + q] = kx(r) ** 2 + ((2 * Math.PI * j) / grid.lengthYUm) ** 2;
    }
  }
  const scratch = new Float64Array(grid.cellCount);
  return {
    grid,
    k2PerUm2: k2,
    forward(src, dst) {
      px.forwardRows(src, scratch, ny);
      transpose(scratch, dst, ny, nx); // row r = x-slot r, along y
      py.forwardPair(dst, dst, 0, ny);
      for (let r = 2; r < nx; r += 2) py.complexForward(dst, r * ny, (r + 1) * ny);
    },
    inverse(src, dst) {
      scratch.set(src);
      py.inversePair(scratch, scratch, 0, ny);
      for (let r = 2; r < nx; r += 2) py.complexForward(scratch, r * ny, (r + 1) * ny, true);
      transpose(scratch, dst, nx, ny);
      px.inverseRows(dst, dst, ny);
    },
  };
}
