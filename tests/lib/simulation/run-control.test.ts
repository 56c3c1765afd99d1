import { describe, expect, it } from "vitest";
import {
  chooseTimeStep,
  computeReactionJacobian,
  computeReactionStiffness,
  createLinearDecayReaction,
  evaluateSpatialParameterField,
  createGrid,
  schnakenbergReaction,
  schnakenbergSteadyState,
  simulateReactionDiffusion,
  type ReactionSystem,
  type SimulationOptions,
} from "@/lib/simulation";

const [us, vs] = schnakenbergSteadyState(0.1, 0.9);
const base: SimulationOptions = {
  grid: { lengthUm: [40], cells: [32] },
  diffusionUm2PerS: [1, 10],
  params: { a: 0.1, b: 0.9, gamma: 1 },
  initial: { kind: "steady-state-noise", steadyState: [us, vs], seed: "run-control" },
  endTimeS: 10,
};

describe("initial state", () => {
  it("the same seed gives bit-identical runs; another seed differs; the seed is recorded", () => {
    const r1 = simulateReactionDiffusion(schnakenbergReaction, base);
    const r2 = simulateReactionDiffusion(schnakenbergReaction, base);
    const r3 = simulateReactionDiffusion(schnakenbergReaction, {
      ...base,
      initial: { ...base.initial, seed: "other" } as SimulationOptions["initial"],
    });
    expect(r1.seed).toBe("run-control");
    expect(Array.from(r1.fields[0])).toEqual(Array.from(r2.fields[0]));
    expect(Array.from(r1.fields[0])).not.toEqual(Array.from(r3.fields[0]));
  });

  it("noise stays within ±amplitude around the steady state (default 1 % of |c*|)", () => {
    const r = simulateReactionDiffusion(schnakenbergReaction, { ...base, snapshotTimesS: [0] });
    const u = r.snapshots[0].fields[0];
    expect(Math.max(...u.map((x) => Math.abs(x - us)))).toBeLessThanOrEqual(0.01 * us);
    expect(Math.max(...u.map((x) => Math.abs(x - us)))).toBeGreaterThan(0.005 * us);
  });
});

describe("parameters varying in space", () => {
  const grid = createGrid({ lengthUm: [100, 50], cells: [4, 4] });
  it.each([
    // Values at cell centres x = 12.5, 37.5, 62.5, 87.5 µm (geometry).
    [{ kind: "linear", fromValue: 0, toValue: 1 } as const, [0.125, 0.375, 0.625, 0.875]],
    [
      { kind: "exponential", value0: 2, decayLengthUm: 25 } as const,
      [2 * Math.exp(-0.5), 2 * Math.exp(-1.5), 2 * Math.exp(-2.5), 2 * Math.exp(-3.5)],
    ],
    [{ kind: "table", positionsUm: [25, 75], values: [1, 3] } as const, [1, 1.5, 2.5, 3]],
  ])("%j along x", (profile, expected) => {
    const f = evaluateSpatialParameterField(profile, grid, "p");
    for (let iy = 0; iy < 4; iy++) expected.forEach((v, ix) => expect(f[iy * 4 + ix]).toBeCloseTo(v, 12));
  });

  it("a linear profile along y varies between rows only", () => {
    const f = evaluateSpatialParameterField({ kind: "linear", axis: "y", fromValue: 0, toValue: 50 }, grid, "p");
    // Row centres y = 6.25, 18.75, 31.25, 43.75 µm (geometry).
    expect(Array.from(f)).toEqual([6.25, 18.75, 31.25, 43.75].flatMap((y) => [y, y, y, y]));
  });

  it("per-cell decay rates act cell by cell without diffusion (exact ODE solution e^{−r(x)t})", () => {
    const r = simulateReactionDiffusion(createLinearDecayReaction(1), {
      grid: { lengthUm: [40], cells: [8] },
      diffusionUm2PerS: [0],
      spatialParams: { rate: { kind: "linear", fromValue: 0, toValue: 0.4 } },
      initial: { kind: "fields", fields: [new Float64Array(8).fill(1)] },
      endTimeS: 5,
      dtS: 0.01,
      scheme: "etd2",
    });
    for (let j = 0; j < 8; j++) {
      const rate = (0.4 * (j + 0.5)) / 8;
      // Without diffusion ETD2 is Adams-Bashforth 2 started by Euler: error below
      // (5/12)h^2 r^3 T + h^2 r^2 / 2 relative (Hairer, Norsett & Wanner, Solving ODEs I, section III.1).
      const bound = (5 / 12) * 1e-4 * rate ** 3 * 5 + 0.5 * 1e-4 * rate ** 2;
      expect(Math.abs(r.fields[0][j] / Math.exp(-rate * 5) - 1)).toBeLessThan(bound);
    }
  });
});

describe("step-size rule", () => {
  it("numerical Jacobian matches the analytic Schnakenberg Jacobian (Murray 2003 ch. 2 closed form)", () => {
    const { jacobian: _, ...noJac } = schnakenbergReaction;
    const numeric = computeReactionJacobian(noJac as ReactionSystem, [us, vs], { a: 0.1, b: 0.9, gamma: 1 });
    const exact = [(0.9 - 0.1) / 1, 1, -1.8, -1];
    exact.forEach((v, i) => expect(numeric[i]).toBeCloseTo(v, 7));
  });

  it("ρ(J) of Schnakenberg a = 0.1, b = 0.9: eigenvalues −0.1 ± i√0.99, |λ| = √det J = 1", () => {
    // det J = f_u g_v − f_v g_u = −0.8 + 1.8 = 1 (closed form above).
    expect(computeReactionStiffness(schnakenbergReaction, [us, vs], { a: 0.1, b: 0.9, gamma: 1 }, 1)).toBeCloseTo(
      1,
      12,
    );
    expect(computeReactionStiffness(schnakenbergReaction, [us, vs], { a: 0.1, b: 0.9, gamma: 50 }, 1)).toBeCloseTo(
      50,
      10,
    );
  });

  it("h = min(user cap, safety/ρ), shortened so whole steps end at endTimeS", () => {
    expect(chooseTimeStep(10, 4, 0.1, null)).toMatchObject({ dtS: 0.025, steps: 400, stiffnessLimitS: 0.025 });
    expect(chooseTimeStep(10, 4, 0.1, 0.01)).toMatchObject({ dtS: 0.01, steps: 1000 });
    const r = chooseTimeStep(1, 3, 0.1, null);
    expect(r.steps).toBe(30);
    expect(r.dtS * r.steps).toBeCloseTo(1, 14);
    const run = simulateReactionDiffusion(schnakenbergReaction, { ...base, params: { a: 0.1, b: 0.9, gamma: 20 } });
    expect(run.timeStep.dtS).toBeCloseTo(0.005, 14);
    expect(run.steps).toBe(2000);
  });
});

describe("stopping, snapshots, progress, cancellation, blow-up", () => {
  it("stops when stationary: diffusion of a cosine mode relaxing to its mean", () => {
    // Diffusion of 1 + 0.1cos(πx/L) relaxes to the mean 1; relative change rate → 0.
    const f = Float64Array.from({ length: 32 }, (_, j) => 1 + 0.1 * Math.cos((Math.PI * (j + 0.5)) / 32));
    const r = simulateReactionDiffusion(createLinearDecayReaction(1), {
      grid: { lengthUm: [10], cells: [32] },
      diffusionUm2PerS: [1],
      params: { rate: 0 },
      initial: { kind: "fields", fields: [f] },
      endTimeS: 1000,
      dtS: 0.1,
      stopWhenStationary: true,
      stationarity: { tolerancePerS: 1e-8, windowS: 1 },
    });
    expect(r.stopReason).toBe("stationary");
    expect(r.stationary).toBe(true);
    expect(r.lastChangeRatePerS!).toBeLessThan(1e-8);
    // The mode's amplitude is A(t) = 0.1e^{−k²t}, k = π/10 (heat equation). Over a window W = 1 s the
    // change is A(t)(e^{k²W} − 1) times cos, whose cell sum of squares is N/2 (DCT orthogonality),
    // against ‖c‖ ≈ √N: rate = A(t)(e^{k²} − 1)/√2, below 1e-8 from t* on; checks fall on whole seconds.
    const k2 = (Math.PI / 10) ** 2;
    const predicted = Math.log((0.1 * Math.expm1(k2)) / (Math.SQRT2 * 1e-8)) / k2;
    expect(r.timeS).toBeGreaterThanOrEqual(predicted);
    expect(r.timeS).toBeLessThan(predicted + 1);
    expect(r.message).toMatch(/^Stationary at t = /);
  });

  it("snapshots at requested times, progress fractions increase to 1", () => {
    const seen: number[] = [];
    const percents: number[] = [];
    const r = simulateReactionDiffusion(schnakenbergReaction, {
      ...base,
      dtS: 0.1,
      snapshotTimesS: [0, 2.5, 5],
      onProgress: (p) => {
        seen.push(p.fraction);
        percents.push(p.percent);
      },
      progressEverySteps: 10,
    });
    expect(r.snapshots.map((s) => [s.requestedTimeS, s.step])).toEqual([
      [0, 0],
      [2.5, 25],
      [5, 50],
    ]);
    expect(r.snapshots[2].timeS).toBeCloseTo(5, 12);
    expect(seen.at(-1)).toBe(1);
    expect(percents).toEqual(seen.map((f) => 100 * f));
    expect(seen.length).toBe(10);
    expect(seen.every((v, i) => i === 0 || v > seen[i - 1])).toBe(true);
    expect(r.stopReason).toBe("end-time");
    expect(r.message).toBe("Reached endTimeS = 10 s after 100 steps.");
  });

  it("cancels between steps via shouldStop and via an AbortSignal", () => {
    let calls = 0;
    const r = simulateReactionDiffusion(schnakenbergReaction, { ...base, dtS: 0.1, shouldStop: () => ++calls > 7 });
    expect(r.stopReason).toBe("cancelled");
    expect(r.steps).toBe(7);
    const ctl = new AbortController();
    const r2 = simulateReactionDiffusion(schnakenbergReaction, {
      ...base,
      dtS: 0.1,
      progressEverySteps: 3,
      onProgress: (p) => p.steps >= 3 && ctl.abort(),
      signal: ctl.signal,
    });
    expect(r2.steps).toBe(3);
    expect(r2.message).toBe("Cancelled at t = 0.30000000000000004 s after 3 steps.");
  });

  it("detects blow-up, keeps the last good state and reports when", () => {
    // R = +u² blows up in finite time 1/u0 = 1 s (exact ODE solution u = u0/(1 − u0 t)).
    const explode: ReactionSystem = {
      species: 1,
      evaluate(f, _p, out) {
        for (let i = 0; i < f[0].length; i++) out[0][i] = f[0][i] * f[0][i];
      },
    };
    const r = simulateReactionDiffusion(explode, {
      grid: { lengthUm: [10], cells: [8] },
      diffusionUm2PerS: [1],
      initial: { kind: "fields", fields: [new Float64Array(8).fill(1)] },
      endTimeS: 2,
      dtS: 0.01,
      blowUpAbs: 1e6,
      scheme: "implicit-euler",
    });
    expect(r.stopReason).toBe("blow-up");
    expect(r.blowUp!.lastGoodTimeS).toBeGreaterThan(0.9);
    expect(r.blowUp!.lastGoodTimeS).toBeLessThan(1.1);
    expect(r.timeS).toBe(r.blowUp!.lastGoodTimeS);
    expect(r.stats[0].max).toBeLessThanOrEqual(1e6);
    expect(r.message).toMatch(
      /^Blow-up at step \d+ \(t = [\d.]+ s\): \|c\| reached .* above blowUpAbs = 1000000; the fields are the last good state/,
    );
  });

  it("reports NaN as blow-up", () => {
    const nan: ReactionSystem = {
      species: 1,
      evaluate(f, _p, out) {
        out[0].fill(NaN);
      },
    };
    const r = simulateReactionDiffusion(nan, {
      grid: { lengthUm: [10], cells: [8] },
      diffusionUm2PerS: [1],
      initial: { kind: "fields", fields: [new Float64Array(8)] },
      endTimeS: 1,
      dtS: 0.1,
    });
    expect(r.blowUp).toMatchObject({ step: 1, lastGoodTimeS: 0 });
    expect(r.message).toContain("a field value became NaN or infinite");
    expect(Array.from(r.fields[0])).toEqual(new Array(8).fill(0));
  });

  it("summarises min / max / mean per species with names", () => {
    const r = simulateReactionDiffusion(schnakenbergReaction, base);
    expect(r.speciesNames).toEqual(["u", "v"]);
    const u = r.fields[0];
    expect(r.stats[0]).toEqual({
      min: Math.min(...u),
      max: Math.max(...u),
      mean: u.reduce((a, b) => a + b, 0) / u.length,
    });
  });
});
