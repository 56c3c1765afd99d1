import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { DctPlan } from "@/lib/fft";
import { createCosineBasis, createGrid } from "@/lib/simulation";

function randomArray(n: number, seed: string): Float64Array {
  const rng = seedrandom(seed);
  return Float64Array.from({ length: n }, () => 2 * rng() - 1);
}

/** Direct O(N²) DCT-II: X_k = Σ x_n cos(πk(2n+1)/(2N)) (definition, Ahmed, Natarajan & Rao (1974) IEEE Trans. Comput. C-23:90). */
function directDct(x: Float64Array): Float64Array {
  const N = x.length;
  return Float64Array.from({ length: N }, (_, k) => {
    let s = 0;
    for (let n = 0; n < N; n++) s += x[n] * Math.cos((Math.PI * k * (2 * n + 1)) / (2 * N));
    return s;
  });
}

describe("DctPlan (Makhoul N-point DCT-II on fft.js)", () => {
  it.each([4, 8, 16, 64, 256, 1024])("matches the direct O(N²) sum for N = %i", (N) => {
    const x = randomArray(N, `dct-${N}`);
    const out = new Float64Array(N);
    new DctPlan(N).forwardRows(x, out, 1);
    const ref = directDct(x);
    // Tolerance: rounding of an N-term sum of O(1) values, common practice, no source.
    for (let k = 0; k < N; k++) expect(out[k]).toBeCloseTo(ref[k], 10);
  });

  it.each([3, 4, 7])("packs %i rows two per FFT and still matches the direct sum row by row", (rows) => {
    const N = 32;
    const x = randomArray(N * rows, `rows-${rows}`);
    const out = new Float64Array(N * rows);
    new DctPlan(N).forwardRows(x, out, rows);
    for (let r = 0; r < rows; r++) {
      const ref = directDct(x.subarray(r * N, (r + 1) * N));
      for (let k = 0; k < N; k++) expect(out[r * N + k]).toBeCloseTo(ref[k], 10);
    }
  });

  it.each([4, 16, 128, 2048])("inverse(forward(x)) = x for N = %i (round trip)", (N) => {
    const x = randomArray(N * 3, `rt-${N}`);
    const plan = new DctPlan(N);
    const spec = new Float64Array(x.length),
      back = new Float64Array(x.length);
    plan.forwardRows(x, spec, 3);
    plan.inverseRows(spec, back, 3);
    for (let i = 0; i < x.length; i++) expect(back[i]).toBeCloseTo(x[i], 12);
  });

  it("in-place forward equals out-of-place forward", () => {
    const x = randomArray(64, "inplace");
    const a = new Float64Array(64),
      b = Float64Array.from(x);
    const plan = new DctPlan(32);
    plan.forwardRows(x, a, 2);
    plan.forwardRows(b, b, 2);
    expect(Array.from(b)).toEqual(Array.from(a));
  });
});

describe("createCosineBasis", () => {
  it.each([
    [
      [8, 16],
      [30, 50],
    ],
    [
      [32, 32],
      [10, 10],
    ],
    [
      [64, 4],
      [5, 200],
    ],
  ])("2-D round trip on %j cells of %j µm and unchanged input", (cells, lengthUm) => {
    const grid = createGrid({ cells, lengthUm });
    const basis = createCosineBasis(grid);
    const x = randomArray(grid.cellCount, `2d-${cells}`);
    const copy = Float64Array.from(x);
    const spec = new Float64Array(x.length),
      back = new Float64Array(x.length);
    basis.forward(x, spec);
    const specCopy = Float64Array.from(spec);
    basis.inverse(spec, back);
    expect(Array.from(x)).toEqual(Array.from(copy));
    expect(Array.from(spec)).toEqual(Array.from(specCopy));
    for (let i = 0; i < x.length; i++) expect(back[i]).toBeCloseTo(x[i], 12);
  });

  it("maps cos(mπx/Lx)·cos(nπy/Ly) at cell centres to one coefficient with k² = (mπ/Lx)² + (nπ/Ly)²", () => {
    // Zero-flux rectangle eigenfunctions, SCIENCE.md §2.
    const grid = createGrid({ cells: [16, 8], lengthUm: [40, 20] });
    const basis = createCosineBasis(grid);
    const m = 3,
      n = 2;
    const x = new Float64Array(grid.cellCount);
    for (let iy = 0; iy < 8; iy++)
      for (let ix = 0; ix < 16; ix++) {
        x[iy * 16 + ix] =
          Math.cos((m * Math.PI * (ix + 0.5) * 2.5) / 40) * Math.cos((n * Math.PI * (iy + 0.5) * 2.5) / 20);
      }
    const spec = new Float64Array(x.length);
    basis.forward(x, spec);
    const j = m * 8 + n; // transposed layout kx·ny + ky
    // Orthogonality of the DCT-II basis: Σ cos² over N cells = N/2 per axis (m, n ≥ 1).
    expect(spec[j]).toBeCloseTo(8 * 4, 10);
    spec.forEach((v, i) => {
      if (i !== j) expect(Math.abs(v)).toBeLessThan(1e-10);
    });
    expect(basis.k2PerUm2[j]).toBeCloseTo(((m * Math.PI) / 40) ** 2 + ((n * Math.PI) / 20) ** 2, 14);
  });
});
