import { describe, expect, it } from "vitest";
import {
  SimulationOptionError,
  createGrid,
  schnakenbergReaction,
  simulateReactionDiffusion,
  type SimulationOptions,
} from "@/lib/simulation";

const base: SimulationOptions = {
  grid: { lengthUm: [40], cells: [32] },
  diffusionUm2PerS: [1, 10],
  params: { a: 0.1, b: 0.9, gamma: 1 },
  initial: { kind: "steady-state-noise", steadyState: [1, 0.9], seed: 1 },
  endTimeS: 10,
};

function errorOf(patch: Partial<SimulationOptions>): SimulationOptionError {
  try {
    simulateReactionDiffusion(schnakenbergReaction, { ...base, ...patch } as SimulationOptions);
  } catch (e) {
    if (e instanceof SimulationOptionError) return e;
    throw e;
  }
  throw new Error("no error thrown");
}

describe("exact error messages (common practice, no source)", () => {
  it.each<[string, Partial<SimulationOptions>, string, string]>([
    [
      "non-power-of-two cells",
      { grid: { lengthUm: [40], cells: [100] } },
      "grid.cells",
      "grid.cells[0] must be a power of two (fft.js sizes), got 100; use 64 or 128.",
    ],
    [
      "too many 2-D cells",
      { grid: { lengthUm: [40, 40], cells: [4096, 32] } },
      "grid.cells",
      "grid.cells[0] must be an integer from 4 to 2048, got 4096.",
    ],
    [
      "too few cells",
      { grid: { lengthUm: [40], cells: [2] } },
      "grid.cells",
      "grid.cells[0] must be an integer from 4 to 65536, got 2.",
    ],
    [
      "3 lengths",
      { grid: { lengthUm: [1, 2, 3], cells: [8, 8, 8] } },
      "grid.lengthUm",
      "grid.lengthUm must list 1 (interval) or 2 (rectangle) lengths.",
    ],
    [
      "cell list mismatch",
      { grid: { lengthUm: [1, 2], cells: [8] } },
      "grid.cells",
      "grid.cells must list one cell count per entry of grid.lengthUm.",
    ],
    [
      "negative length",
      { grid: { lengthUm: [-1], cells: [8] } },
      "grid.lengthUm",
      "grid.lengthUm[0] must be a positive finite length, got -1.",
    ],
    [
      "wrong diffusion count",
      { diffusionUm2PerS: [1] },
      "diffusionUm2PerS",
      "diffusionUm2PerS must have 2 values (one per species), got 1.",
    ],
    [
      "negative diffusion",
      { diffusionUm2PerS: [1, -2] },
      "diffusionUm2PerS",
      "diffusionUm2PerS[1] must be a finite number ≥ 0, got -2.",
    ],
    ["zero end time", { endTimeS: 0 }, "endTimeS", "endTimeS must be a positive finite number, got 0."],
    ["negative dt", { dtS: -1 }, "dtS", "dtS must be a positive finite number, got -1."],
    [
      "too many steps",
      { endTimeS: 1e6, dtS: 1e-2 },
      "dtS",
      "endTimeS / dtS needs 100000000 steps; the limit is 10000000.",
    ],
    ["safety", { stiffnessSafety: 3 }, "stiffnessSafety", "stiffnessSafety must be in (0, 2], got 3."],
    [
      "scheme",
      { scheme: "rk4" as never },
      "scheme",
      "scheme must be one of implicit-euler, integrating-factor, etd2, got rk4.",
    ],
    ["NaN param", { params: { a: NaN } }, "params.a", "params.a must be a finite number, got NaN."],
    ["unsorted snapshots", { snapshotTimesS: [2, 1] }, "snapshotTimesS", "snapshotTimesS must increase strictly."],
    [
      "snapshot after end",
      { snapshotTimesS: [11] },
      "snapshotTimesS",
      "snapshotTimesS[0] must be in [0, endTimeS = 10], got 11.",
    ],
    [
      "progress every",
      { progressEverySteps: 0 },
      "progressEverySteps",
      "progressEverySteps must be an integer ≥ 1, got 0.",
    ],
    [
      "window",
      { stationarity: { windowS: 0 } },
      "stationarity.windowS",
      "stationarity.windowS must be a positive finite number, got 0.",
    ],
    [
      "steady state length",
      { initial: { kind: "steady-state-noise", steadyState: [1] } },
      "initial.steadyState",
      "initial.steadyState must have 2 values (one per species), got 1.",
    ],
    [
      "noise",
      { initial: { kind: "steady-state-noise", steadyState: [1, 1], noiseAmplitude: -1 } },
      "initial.noiseAmplitude",
      "initial.noiseAmplitude[0] must be a finite number ≥ 0, got -1.",
    ],
    [
      "field count",
      { initial: { kind: "fields", fields: [new Float64Array(32)] } },
      "initial.fields",
      "initial.fields must have 2 fields (one per species), got 1.",
    ],
    [
      "field length",
      { initial: { kind: "fields", fields: [new Float64Array(32), new Float64Array(8)] } },
      "initial.fields",
      "initial.fields[1] must have 32 values (one per cell), got 8.",
    ],
    [
      "profile axis",
      { spatialParams: { a: { kind: "linear", axis: "y", fromValue: 0, toValue: 1 } } },
      "spatialParams.a.axis",
      'spatialParams.a.axis must be "x" on a 1-D grid.',
    ],
    [
      "profile table",
      { spatialParams: { a: { kind: "table", positionsUm: [1], values: [1] } } },
      "spatialParams.a",
      "spatialParams.a needs at least 2 positions and as many values, got 1 positions and 1 values.",
    ],
    [
      "profile table order",
      { spatialParams: { a: { kind: "table", positionsUm: [2, 1], values: [1, 2] } } },
      "spatialParams.a.positionsUm",
      "spatialParams.a.positionsUm must increase strictly.",
    ],
    [
      "profile decay",
      { spatialParams: { a: { kind: "exponential", value0: 1, decayLengthUm: 0 } } },
      "spatialParams.a.decayLengthUm",
      "spatialParams.a.decayLengthUm must be positive, got 0.",
    ],
    [
      "profile field",
      { spatialParams: { a: { kind: "field", values: [1, 2] } } },
      "spatialParams.a",
      "spatialParams.a.values must have one value per cell (32), got 2.",
    ],
  ])("%s", (_label, patch, field, message) => {
    const e = errorOf(patch);
    expect(e).toBeInstanceOf(RangeError);
    expect(e.field).toBe(field);
    expect(e.message).toBe(message);
  });

  it("rejects too many species", () => {
    const big = { ...schnakenbergReaction, species: 7 };
    expect(() => simulateReactionDiffusion(big, base)).toThrow("system.species must be an integer from 1 to 6, got 7.");
  });

  it("createGrid alone gives the same sentences", () => {
    expect(() => createGrid({ lengthUm: [10, 10], cells: [48, 64] })).toThrow(
      "grid.cells[0] must be a power of two (fft.js sizes), got 48; use 32 or 64.",
    );
  });
});
