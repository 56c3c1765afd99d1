import { describe, expect, it } from "vitest";
import { createLinearDecayReaction, simulateReactionDiffusion, type SchemeName } from "@/lib/simulation";

const pureDiffusion = createLinearDecayReaction(1);

describe("pure diffusion of a cosine mode (heat equation, exact solution e^{−Dk²t})", () => {
  // u = 1 + cos(kx) with k = mπ/L solves u_t = D u_xx with zero-flux ends; the mode decays as
  // e^{−Dk²t} (separation of variables, e.g. Murray 2003 ch. 2; SCIENCE.md §8).
  const N = 64,
    L = 100,
    D = 5,
    m = 3,
    T = 10,
    h = 0.1;
  const k = (m * Math.PI) / L;
  const init = Float64Array.from({ length: N }, (_, j) => 1 + Math.cos(k * (j + 0.5) * (L / N)));
  const cases: [SchemeName, (t: number) => number, number][] = [
    // Exact per mode: e^{−Dk²t}; rounding only.
    ["integrating-factor", (t) => Math.exp(-D * k * k * t), 1e-13],
    ["etd2", (t) => Math.exp(-D * k * k * t), 1e-13],
    // Implicit Euler multiplies the mode by (1 + hDk²)^{−1} per step (the scheme's own formula).
    ["implicit-euler", (t) => (1 + h * D * k * k) ** -(t / h), 1e-12],
  ];
  it.each(cases)("%s reproduces the mode's amplitude", (scheme, amplitude, tol) => {
    const r = simulateReactionDiffusion(pureDiffusion, {
      grid: { lengthUm: [L], cells: [N] },
      diffusionUm2PerS: [D],
      params: { rate: 0 },
      initial: { kind: "fields", fields: [init] },
      endTimeS: T,
      dtS: h,
      scheme,
    });
    expect(r.steps).toBe(100);
    expect(r.timeS).toBeCloseTo(T, 12);
    for (let j = 0; j < N; j++) expect(Math.abs(r.fields[0][j] - (1 + amplitude(T) * (init[j] - 1)))).toBeLessThan(tol);
  });

  it("implicit Euler's amplitude is within O(h) of e^{−Dk²t} (first order)", () => {
    const r = simulateReactionDiffusion(pureDiffusion, {
      grid: { lengthUm: [L], cells: [N] },
      diffusionUm2PerS: [D],
      params: { rate: 0 },
      initial: { kind: "fields", fields: [init] },
      endTimeS: T,
      dtS: h,
      scheme: "implicit-euler",
    });
    const exact = Math.exp(-D * k * k * T);
    const got = r.fields[0][0] - 1;
    const want = exact * (init[0] - 1);
    // Local error ½(hDk²)² per step → relative error ≈ ½ h (Dk²)² T (Taylor expansion, from memory).
    const bound = 0.5 * h * (D * k * k) ** 2 * T * 1.5;
    expect(Math.abs(got - want) / Math.abs(want)).toBeLessThan(bound);
    expect(Math.abs(got - want)).toBeGreaterThan(0);
  });

  it("2-D rectangle mode cos(mπx/Lx)cos(nπy/Ly) decays as e^{−D(kx² + ky²)t}", () => {
    const nx = 32,
      ny = 16,
      lx = 80,
      ly = 40,
      mx = 2,
      my = 1,
      D2 = 3,
      T2 = 20;
    const k2 = ((mx * Math.PI) / lx) ** 2 + ((my * Math.PI) / ly) ** 2;
    const f = new Float64Array(nx * ny);
    for (let iy = 0; iy < ny; iy++)
      for (let ix = 0; ix < nx; ix++) {
        f[iy * nx + ix] = Math.cos((mx * Math.PI * (ix + 0.5)) / nx) * Math.cos((my * Math.PI * (iy + 0.5)) / ny);
      }
    const r = simulateReactionDiffusion(pureDiffusion, {
      grid: { lengthUm: [lx, ly], cells: [nx, ny] },
      diffusionUm2PerS: [D2],
      params: { rate: 0 },
      initial: { kind: "fields", fields: [f] },
      endTimeS: T2,
      dtS: 0.5,
      scheme: "integrating-factor",
    });
    const a = Math.exp(-D2 * k2 * T2);
    for (let i = 0; i < f.length; i++) expect(Math.abs(r.fields[0][i] - a * f[i])).toBeLessThan(1e-13);
  });
});

describe("mass conservation with zero-flux boundaries", () => {
  // d/dt ∫u = ∫D∇²u = D∮∂u/∂n = 0 (divergence theorem); the k = 0 coefficient has multiplier 1.
  it.each(["implicit-euler", "integrating-factor", "etd2"] as const)(
    "%s keeps the mean of a random field",
    (scheme) => {
      const r = simulateReactionDiffusion(createLinearDecayReaction(2), {
        grid: { lengthUm: [50, 30], cells: [32, 16] },
        diffusionUm2PerS: [2, 7],
        params: { rate: 0 },
        initial: { kind: "steady-state-noise", steadyState: [1, 3], noiseAmplitude: 0.5, seed: "mass" },
        endTimeS: 40,
        dtS: 0.4,
        scheme,
      });
      const start = simulateReactionDiffusion(createLinearDecayReaction(2), {
        grid: { lengthUm: [50, 30], cells: [32, 16] },
        diffusionUm2PerS: [2, 7],
        params: { rate: 0 },
        initial: { kind: "steady-state-noise", steadyState: [1, 3], noiseAmplitude: 0.5, seed: "mass" },
        endTimeS: 40,
        dtS: 40,
        snapshotTimesS: [0],
        scheme,
      }).snapshots[0].fields;
      for (let s = 0; s < 2; s++) {
        const m0 = start[s].reduce((a, b) => a + b, 0) / start[s].length;
        expect(Math.abs(r.stats[s].mean - m0)).toBeLessThan(1e-12);
        // and diffusion did smooth the field: the range shrank
        expect(r.stats[s].max - r.stats[s].min).toBeLessThan(0.5);
      }
    },
  );

  it("linear decay R = −ru makes the mean decay as e^{−rt} (exact ODE solution) with ETD2 within O(h²)", () => {
    const rate = 0.05,
      T = 20;
    const r = simulateReactionDiffusion(createLinearDecayReaction(1), {
      grid: { lengthUm: [40], cells: [32] },
      diffusionUm2PerS: [1],
      params: { rate },
      initial: { kind: "steady-state-noise", steadyState: [2], noiseAmplitude: 0.1, seed: 7 },
      endTimeS: T,
      dtS: 0.1,
      scheme: "etd2",
      snapshotTimesS: [0],
    });
    const m0 = r.snapshots[0].fields[0].reduce((a, b) => a + b, 0) / 32;
    // The k = 0 mode has L = 0, where ETD2 is Adams-Bashforth 2 started by one Euler step.
    // Bound: AB2 truncation (5/12)h^3|y'''| per step over T/h steps plus the Euler step's h^2|y''|/2
    // (Hairer, Norsett & Wanner, Solving ODEs I, section III.1), relative to y. A first-order
    // scheme would miss by about h r^2 T / 2 = 2.5e-3.
    const h = 0.1;
    const bound = (5 / 12) * h * h * rate ** 3 * T + 0.5 * h * h * rate * rate;
    expect(Math.abs(r.stats[0].mean / (m0 * Math.exp(-rate * T)) - 1)).toBeLessThan(bound);
  });
});
