import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { RealFftPlan } from "@/lib/fft";
import {
  createGrid,
  createLinearDecayReaction,
  createPeriodicBasis,
  simulateReactionDiffusion,
} from "@/lib/simulation";

const rand = (n: number, seed: string) => {
  const rng = seedrandom(seed);
  return Float64Array.from({ length: n }, () => 2 * rng() - 1);
};

describe("RealFftPlan (half-complex, two rows per complex fft.js transform)", () => {
  it.each([4, 16, 128])("matches the direct DFT sum X_k = Σ x_n e^{−2πikn/N} for N = %i (definition)", (N) => {
    const x = rand(3 * N, `rfft-${N}`);
    const out = new Float64Array(3 * N);
    new RealFftPlan(N).forwardRows(x, out, 3);
    for (let r = 0; r < 3; r++) {
      for (let k = 0; k <= N / 2; k++) {
        let re = 0,
          im = 0;
        for (let n = 0; n < N; n++) {
          re += x[r * N + n] * Math.cos((2 * Math.PI * k * n) / N);
          im -= x[r * N + n] * Math.sin((2 * Math.PI * k * n) / N);
        }
        const o = r * N;
        const [gr, gi] = k === 0 ? [out[o], 0] : k === N / 2 ? [out[o + 1], 0] : [out[o + 2 * k], out[o + 2 * k + 1]];
        expect(gr).toBeCloseTo(re, 10);
        expect(gi).toBeCloseTo(im, 10);
      }
    }
  });

  it.each([
    [[8], [10]],
    [
      [16, 8],
      [30, 20],
    ],
    [
      [32, 32],
      [5, 5],
    ],
  ])("periodic basis round trip on %j cells", (cells, lengthUm) => {
    const grid = createGrid({ cells, lengthUm, boundary: "periodic" });
    const basis = createPeriodicBasis(grid);
    const x = rand(grid.cellCount, `pb-${cells}`);
    const spec = new Float64Array(x.length),
      back = new Float64Array(x.length);
    basis.forward(x, spec);
    const keep = Float64Array.from(spec);
    basis.inverse(spec, back);
    expect(Array.from(spec)).toEqual(Array.from(keep));
    for (let i = 0; i < x.length; i++) expect(back[i]).toBeCloseTo(x[i], 12);
  });
});

describe("periodic diffusion (heat equation on a torus, exact e^{−Dk²t} with k = 2πm/L)", () => {
  it.each([
    { cells: [64], lengthUm: [50], modes: [3], phase: 0.7 },
    { cells: [32, 16], lengthUm: [40, 20], modes: [2, 3], phase: 1.1 },
    { cells: [16, 16], lengthUm: [20, 20], modes: [8, 0], phase: 0 }, // Nyquist along x
  ])("mode $modes on $cells cells", ({ cells, lengthUm, modes, phase }) => {
    const nx = cells[0],
      ny = cells[1] ?? 1,
      D = 2,
      T = 3;
    const f = new Float64Array(nx * ny);
    let k2 = 0;
    modes.forEach((m, i) => (k2 += ((2 * Math.PI * m) / lengthUm[i]) ** 2));
    for (let iy = 0; iy < ny; iy++)
      for (let ix = 0; ix < nx; ix++) {
        f[iy * nx + ix] =
          1 + Math.cos((2 * Math.PI * modes[0] * ix) / nx + (2 * Math.PI * (modes[1] ?? 0) * iy) / ny + phase);
      }
    const r = simulateReactionDiffusion(createLinearDecayReaction(1), {
      grid: { cells, lengthUm, boundary: "periodic" },
      diffusionUm2PerS: [D],
      params: { rate: 0 },
      initial: { kind: "fields", fields: [f] },
      endTimeS: T,
      dtS: 0.1,
      scheme: "etd2",
    });
    const a = Math.exp(-D * k2 * T);
    for (let i = 0; i < f.length; i++) expect(Math.abs(r.fields[0][i] - (1 + a * (f[i] - 1)))).toBeLessThan(1e-12);
    // Total mass is conserved on the torus (no boundary).
    expect(r.stats[0].mean).toBeCloseTo(f.reduce((p, q) => p + q, 0) / f.length, 13);
  });

  it("rejects an unknown boundary with an exact message", () => {
    expect(() => createGrid({ cells: [8], lengthUm: [1], boundary: "dirichlet" as never })).toThrow(
      'grid.boundary must be "zero-flux" or "periodic", got dirichlet.',
    );
  });
});
