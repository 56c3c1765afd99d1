import { describe, expect, it } from "vitest";
import { readPattern } from "@/lib/cli/simulate-output";
import {
  createLinearDecayReaction,
  schnakenbergReaction,
  schnakenbergSteadyState,
  simulateReactionDiffusion,
  SimulationOptionError,
  type SimulationOptions,
} from "@/lib/simulation";
import { proposeStep, roundStepDown } from "@/lib/simulation/step-control";

const [us, vs] = schnakenbergSteadyState(0.1, 0.9);

describe("adaptive steps (ETD2RK with embedded ETD1, step-control.ts)", () => {
  // Schnakenberg a = 0.1, b = 0.9, γ = 1, d = 20 on 64² (the case of issue 15 on a small grid).
  const base: SimulationOptions = {
    grid: { lengthUm: [100, 100], cells: [64, 64] },
    diffusionUm2PerS: [1, 20],
    params: { a: 0.1, b: 0.9, gamma: 1 },
    initial: { kind: "steady-state-noise", steadyState: [us, vs], noiseAmplitude: 0.01, seed: 7 },
    endTimeS: 300,
    snapshotTimesS: [0, 150, 300],
  };

  it("ends in the same pattern as fixed small steps: wavelength within 2 %, same symmetry", () => {
    const fixed = simulateReactionDiffusion(schnakenbergReaction, { ...base, dtS: 0.05 });
    const adaptive = simulateReactionDiffusion(schnakenbergReaction, { ...base, adaptive: {} });
    const a = readPattern(adaptive),
      f = readPattern(fixed);
    expect(f.periodFound && a.periodFound).toBe(true);
    // 2 %: the acceptance limit (common practice, no source).
    expect(Math.abs(a.wavelengthUm! / f.wavelengthUm! - 1)).toBeLessThan(0.02);
    expect(a.symmetry).toBe(f.symmetry);
    // Far fewer steps than the fixed run (stiffness rule: h = 0.1/ρ = 0.1 for ρ = 1 here).
    expect(adaptive.steps).toBeLessThan(fixed.steps / 10);
    expect(adaptive.adaptive!.largestStepS).toBeGreaterThan(10 * adaptive.adaptive!.firstStepS);
    // Steps land exactly on snapshot times and the end time.
    expect(adaptive.snapshots.map((s) => s.timeS)).toEqual([0, 150, 300]);
    expect(adaptive.timeS).toBe(300);
    expect(adaptive.stopReason).toBe("end-time");
  }, 60_000);

  it("is second order without diffusion: linear decay e^{−rt} within the tolerance", () => {
    // dc/dt = −0.5c has the exact solution c0·e^{−0.5t} (closed form).
    const run = (tolerance: number) =>
      simulateReactionDiffusion(createLinearDecayReaction(1), {
        grid: { lengthUm: [10], cells: [8] },
        diffusionUm2PerS: [0],
        params: { rate: 0.5 },
        initial: { kind: "fields", fields: [new Float64Array(8).fill(1)] },
        endTimeS: 4,
        adaptive: { tolerance },
      });
    const coarse = run(1e-3),
      fine = run(1e-5);
    const errCoarse = Math.abs(coarse.fields[0][0] - Math.exp(-2)),
      errFine = Math.abs(fine.fields[0][0] - Math.exp(-2));
    expect(errCoarse).toBeLessThan(1e-2 * Math.exp(-2));
    expect(errFine).toBeLessThan(errCoarse / 10);
    expect(fine.steps).toBeGreaterThan(coarse.steps);
  });

  it("stops when stationary, measured over windows of simulated time", () => {
    // A field at rest (rate 0) is stationary at the first window (definition of the criterion).
    const r = simulateReactionDiffusion(createLinearDecayReaction(1), {
      grid: { lengthUm: [10], cells: [8] },
      diffusionUm2PerS: [1],
      params: { rate: 0 },
      initial: { kind: "fields", fields: [new Float64Array(8).fill(1)] },
      endTimeS: 100,
      adaptive: {},
      stopWhenStationary: true,
      stationarity: { windowS: 5 },
    });
    expect(r.stopReason).toBe("stationary");
    expect(r.timeS).toBeGreaterThanOrEqual(5);
    expect(r.timeS).toBeLessThan(100);
    expect(r.lastChangeRatePerS).toBe(0);
  });

  it("reports simulated time and the current step in progress", () => {
    const seen: { timeS: number; dtS: number }[] = [];
    simulateReactionDiffusion(schnakenbergReaction, {
      ...base,
      grid: { lengthUm: [100], cells: [64] },
      adaptive: {},
      onProgress: (q) => seen.push({ timeS: q.timeS, dtS: q.dtS }),
    });
    expect(seen.length).toBeGreaterThan(10);
    expect(seen.at(-1)!.timeS).toBe(300);
    expect(seen.every((q) => q.dtS > 0)).toBe(true);
    expect(new Set(seen.map((q) => q.dtS)).size).toBeGreaterThan(1);
  });

  it("refuses adaptive steps with another scheme and a tolerance out of range", () => {
    const refuse = (o: Partial<SimulationOptions>) => {
      try {
        simulateReactionDiffusion(schnakenbergReaction, { ...base, ...o });
      } catch (e) {
        if (e instanceof SimulationOptionError) return `${e.field}: ${e.message}`;
        throw e;
      }
      throw new Error("expected a refusal");
    };
    expect(refuse({ adaptive: {}, scheme: "implicit-euler" })).toBe(
      "adaptive: adaptive steps need scheme etd2 (ETD2RK with embedded ETD1), got implicit-euler.",
    );
    expect(refuse({ adaptive: { tolerance: 0.5 } })).toBe(
      "adaptive.tolerance: adaptive.tolerance must be in (0, 0.1], got 0.5.",
    );
  });
});

describe("the step-size controller (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4)", () => {
  it("h·min(5, max(0.2, 0.9·err^(−1/2))) after a rejection or first step; no growth after a rejection", () => {
    expect(proposeStep(1, 0.25, false)).toBeCloseTo(1.8, 12); // 0.9 · 0.25^(−1/2)
    expect(proposeStep(1, 1e-6, false)).toBe(5);
    expect(proposeStep(1, 0.25, true)).toBe(1);
    expect(proposeStep(1, 4, true)).toBeCloseTo(0.45, 12);
    expect(proposeStep(1, NaN, true)).toBe(0.2);
    // PI form (Gustafsson 1991): 0.9 · 0.5^(−0.35) · 0.5^(0.2).
    expect(proposeStep(1, 0.5, false, 0.5)).toBeCloseTo(0.9 * 0.5 ** -0.15, 12);
  });

  it("rounds steps down to 2^(j/8)", () => {
    expect(roundStepDown(1)).toBe(1);
    expect(roundStepDown(0.3)).toBeCloseTo(2 ** (-14 / 8), 12); // 2^(−14/8) = 0.297 ≤ 0.3 < 2^(−13/8)
  });
});
