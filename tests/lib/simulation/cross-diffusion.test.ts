import { expm, matrix, multiply } from "mathjs";
import { describe, expect, it } from "vitest";
import { compileKinetics } from "@/lib/kinetics";
import {
  createLinearDecayReaction,
  decomposeDiffusion,
  readKineticsDiffusion,
  schnakenbergReaction,
  schnakenbergSteadyState,
  simulateReactionDiffusion,
  SimulationOptionError,
} from "@/lib/simulation";

const cosine = (m: number, n: number) =>
  Float64Array.from({ length: n }, (_, i) => Math.cos((m * Math.PI * (i + 0.5)) / n));
const project = (f: Float64Array, phi: Float64Array, base: number) => {
  let num = 0,
    den = 0;
  for (let i = 0; i < f.length; i++) {
    num += (f[i] - base) * phi[i];
    den += phi[i] * phi[i];
  }
  return num / den;
};

describe("cross-diffusion", () => {
  // ∂c/∂t = D∇²c for one cosine mode has the exact solution ĉ(t) = exp(−k²tD) ĉ(0) (linear ODE per
  // mode); the matrix exponential is mathjs's expm (Padé approximation), a general-purpose reference.
  it("a cosine mode of pure cross-diffusion evolves as exp(−k²tD), checked with mathjs expm", () => {
    const D = [
        [1, 0.6],
        [0.3, 2],
      ],
      L = 20,
      N = 64,
      m = 3,
      t = 4;
    const k2 = ((m * Math.PI) / L) ** 2;
    const phi = cosine(m, N);
    const amp0 = [0.7, -0.4];
    const r = simulateReactionDiffusion(createLinearDecayReaction(2), {
      grid: { lengthUm: [L], cells: [N] },
      diffusionUm2PerS: D,
      params: { rate: 0 },
      initial: { kind: "fields", fields: [phi.map((p) => 1 + amp0[0] * p), phi.map((p) => 2 + amp0[1] * p)] },
      endTimeS: t,
      dtS: 0.5,
    });
    const expected = multiply(expm(matrix(D.map((row) => row.map((d) => -k2 * t * d)))), amp0).valueOf() as number[];
    expect(project(r.fields[0], phi, 1)).toBeCloseTo(expected[0], 10);
    expect(project(r.fields[1], phi, 2)).toBeCloseTo(expected[1], 10);
    // Zero flux: the mean of each species is conserved (exactly, up to rounding).
    expect(r.stats[0].mean).toBeCloseTo(1, 12);
    expect(r.stats[1].mean).toBeCloseTo(2, 12);
  });

  it("a matrix with zero off-diagonal entries gives the same bits as the diagonal list", () => {
    const base = {
      grid: { lengthUm: [30, 30], cells: [16, 16] },
      params: { a: 0.1, b: 0.9, gamma: 1 },
      endTimeS: 5,
      dtS: 0.05,
      initial: { kind: "steady-state-noise" as const, steadyState: schnakenbergSteadyState(0.1, 0.9), seed: 3 },
    };
    const a = simulateReactionDiffusion(schnakenbergReaction, { ...base, diffusionUm2PerS: [1, 10] });
    const b = simulateReactionDiffusion(schnakenbergReaction, {
      ...base,
      diffusionUm2PerS: [
        [1, 0],
        [0, 10],
      ],
    });
    expect(Array.from(b.fields[1])).toEqual(Array.from(a.fields[1]));
  });

  it("a small perturbation grows at the leading eigenvalue of J − k²D with cross terms, within 1 %", () => {
    // Schnakenberg γ-form, a = 0.1, b = 0.9: Jacobian in closed form (Murray 2003, Mathematical Biology II, ch. 2).
    const a = 0.1,
      b = 0.9;
    const [us, vs] = schnakenbergSteadyState(a, b);
    const J = [
      [(b - a) / (a + b), (a + b) ** 2],
      [(-2 * b) / (a + b), -((a + b) ** 2)],
    ];
    const D = [
      [1, 0.5],
      [-0.2, 10],
    ];
    const L = 10 * Math.PI,
      N = 64,
      m = 6,
      k2 = ((m * Math.PI) / L) ** 2;
    // 2×2 eigenvalue of M = J − k²D in closed form: σ = tr/2 + √(tr²/4 − det), eigenvector (M01, σ − M00).
    const M = J.map((row, i) => row.map((v, j) => v - k2 * D[i][j]));
    const tr = M[0][0] + M[1][1],
      det = M[0][0] * M[1][1] - M[0][1] * M[1][0];
    const sigma = tr / 2 + Math.sqrt((tr * tr) / 4 - det);
    expect(sigma).toBeGreaterThan(0);
    const vec = [M[0][1], sigma - M[0][0]];
    const eps = 1e-6 / Math.hypot(vec[0], vec[1]);
    const phi = cosine(m, N);
    const u0 = phi.map((p) => us + eps * vec[0] * p),
      v0 = phi.map((p) => vs + eps * vec[1] * p);
    const r = simulateReactionDiffusion(schnakenbergReaction, {
      grid: { lengthUm: [L], cells: [N] },
      diffusionUm2PerS: D,
      params: { a, b, gamma: 1 },
      initial: { kind: "fields", fields: [u0, v0] },
      endTimeS: 40,
      dtS: 0.05,
    });
    const growth = Math.log(project(r.fields[0], phi, us) / project(u0, phi, us)) / r.timeS;
    expect(Math.abs(growth / sigma - 1)).toBeLessThan(0.01);
  });

  it.each([
    [
      "complex eigenvalues",
      [
        [1, -2],
        [2, 1],
      ],
      "the cross-diffusion matrix has complex eigenvalues (1.000 + 2.000i, 1.000 − 2.000i)",
    ],
    [
      "a negative eigenvalue (backward diffusion)",
      [
        [1, 2],
        [2, 1],
      ],
      "the cross-diffusion matrix has a negative eigenvalue (-1.000)",
    ],
    [
      "a defective matrix",
      [
        [1, 1],
        [0, 1],
      ],
      "the cross-diffusion matrix is nearly not diagonalisable",
    ],
  ])("refuses %s with the reason", (_label, D, message) => {
    const run = () =>
      simulateReactionDiffusion(createLinearDecayReaction(2), {
        grid: { lengthUm: [10], cells: [16] },
        diffusionUm2PerS: D,
        params: { rate: 0 },
        initial: { kind: "steady-state-noise", steadyState: [1, 1], seed: 1 },
        endTimeS: 1,
      });
    expect(run).toThrow(SimulationOptionError);
    expect(run).toThrow(message);
  });

  it("reads a lab kinetics' cross-diffusion matrix and refuses an ill-posed one before a run", () => {
    const k = compileKinetics({
      name: "cross",
      species: ["u", "v"],
      parameters: [{ name: "c", default: 0.3 }],
      reactions: ["1 - u", "u - v"],
      diffusion: [
        [1, "c"],
        [0, 2],
      ],
    });
    expect(readKineticsDiffusion(k, [0.3])).toEqual([
      [1, 0.3],
      [0, 2],
    ]);
    expect(() => readKineticsDiffusion(k, [0.3])).not.toThrow();
    const bad = compileKinetics({
      name: "bad",
      species: ["u", "v"],
      parameters: [],
      reactions: ["1 - u", "u - v"],
      diffusion: [
        [1, 3],
        [3, 1],
      ],
    });
    expect(() => readKineticsDiffusion(bad, [])).toThrow(
      "kinetics.diffusion: the cross-diffusion matrix has a negative eigenvalue (-2.000)",
    );
  });

  it("the mode decomposition reproduces D = VΛV⁻¹", () => {
    const D = [
      [2, 0.5, 0],
      [0.1, 1, 0.2],
      [0, 0.3, 4],
    ];
    const { diffusivities, toSpecies, toModes } = decomposeDiffusion(D);
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        let v = 0;
        for (let s = 0; s < 3; s++) v += toSpecies[i * 3 + s] * diffusivities[s] * toModes[s * 3 + j];
        expect(v).toBeCloseTo(D[i][j], 12);
      }
  });
});
