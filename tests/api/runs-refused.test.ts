/**
 * Verification runs refused before any job exists: limits answer 422 with exact sentences; a bench scientist may not start one.
 */
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { setupRunsLab } from "../support/runs";

const { api, RUNS } = setupRunsLab();

describe("refused before any job exists", () => {
  const base = { kinetics: "schnakenberg", grid: { lengthUm: [100, 100], cells: [64, 64] }, endTimeS: 10 };
  it.each([
    [
      "cells not a power of two",
      { grid: { lengthUm: [100, 100], cells: [100, 64] } },
      "Cells per axis must be a power of two (fft.js sizes), got 100; use 64 or 128.",
    ],
    [
      "a rectangle above 2048 per axis",
      { grid: { lengthUm: [100, 100], cells: [4096, 64] } },
      "Cells per axis must be an integer from 4 to 2048, got 4096.",
    ],
    [
      "too many steps",
      { endTimeS: 2e6 },
      "Simulated time divided by the step cap needs 20000000 steps; the limit is 10000000.",
    ],
    [
      "over the CPU budget",
      { grid: { lengthUm: [100, 100], cells: [512, 512] }, endTimeS: 1000 },
      "Cells per axis: 262144 cells × 2 species × 10000 steps = 5242880000 cell-steps; one run may take at most 2621440000 (256² cells × 2 species × 20000 steps, about 103 s on this server). Use fewer cells or a shorter simulated time.",
    ],
    [
      "a stable steady state",
      { parameters: { d: 5 } },
      "Parameter values: the homogeneous steady state is stable at these parameter values — no mode grows, so the noise decays and there is no pattern to read. Choose parameters inside the Turing space (see the Turing-space map of this kinetics).",
    ],
    [
      "a parameter out of range",
      { parameters: { a: 500 } },
      "Parameter a = 500 is outside its allowed range [0, 100].",
    ],
  ])("%s", async (_what, change, message) => {
    const m = await database();
    const before = await m.Job.count();
    const res = await api("POST", RUNS, { json: { ...base, ...change } });
    expect(res.body.error.message).toBe(message);
    expect(res.status).toBe(message.startsWith("Parameter a") ? 400 : 422);
    expect(await m.Job.count()).toBe(before);
  });

  it("a bench scientist may not start a run", async () => {
    const res = await api("POST", RUNS, { who: "scientist", json: base });
    expect(res.status).toBe(403);
  });
});
