/**
 * The core's run planner (lib/simulation/plan-run.ts) without a server: what a run will do and
 * whether it may. Messages are the ones the API answers with (tests/api/runs.test.ts).
 */
import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import {
  planRun,
  planRunSteadyState,
  RUN_WORK_LIMIT,
  SimulationOptionError,
  SOLVER_CELL_STEPS_PER_S,
  type RunPlanContext,
  type RunRequest,
} from "@/lib/simulation";
import { computeDispersion } from "@/lib/stability";

const schnakenberg = getCatalogueKinetics("schnakenberg");
const base: RunRequest = {
  kinetics: schnakenberg,
  units: schnakenberg.units,
  parameters: { a: 0.1, b: 0.9, d: 20 },
  grid: { lengthUm: [100, 100], cells: [64, 64] },
  endTimeS: 300,
  snapshots: 4,
};
const context: RunPlanContext = {
  start: null,
  fromFit: null,
  kineticsSource: { catalogue: "schnakenberg" },
  seed: 1,
  threads: 2,
};
const plan = (change: Partial<RunRequest> = {}) => planRun(planRunSteadyState({ ...base, ...change }), context);

/** The refusal's field and exact sentence. */
function refusal(fn: () => unknown): { field: string; message: string } {
  try {
    fn();
  } catch (err) {
    if (err instanceof SimulationOptionError) return { field: err.field, message: err.message };
    throw err;
  }
  throw new Error("expected a refusal");
}

describe("planRun (pure: no database, no clock, no randomness)", () => {
  it("plans a Turing run: linear prediction, step rule, snapshots and the work estimate", () => {
    const { spec, plan: p } = plan();
    // Linear theory at the same parameters (SCIENCE.md §1), by the stability core.
    const linear = computeDispersion(schnakenberg, { a: 0.1, b: 0.9, d: 20 });
    expect(p.prediction!.wavelength).toBe(linear.fastest!.wavelength);
    expect(p.dtS * p.steps).toBeWithinRelative(300, 1e-12); // the step rule divides endTimeS evenly (step-size.ts)
    expect(p.workCellSteps).toBe(64 * 64 * 2 * p.steps);
    expect(p.estimatedCpuS).toBe(p.workCellSteps / SOLVER_CELL_STEPS_PER_S[2]);
    expect(spec.snapshotTimesS).toEqual([0, 100, 200, 300]);
    expect(spec).toMatchObject({ kinetics: { catalogue: "schnakenberg" }, initial: { seed: 1 }, scheme: "etd2" });
    expect(p.warnings).toEqual([]);
  });

  it("gives the same plan twice (the caller picks the seed)", () => {
    expect(plan()).toEqual(plan());
  });

  it.each([
    [
      "a stable steady state",
      { parameters: { d: 5 } },
      "parameters",
      "parameters: the homogeneous steady state is stable at these parameter values — no mode grows, so the noise decays and there is no pattern to read. Choose parameters inside the Turing space (see the Turing-space map of this kinetics).",
    ],
    ["too many steps", { endTimeS: 2e6 }, "dtS", "endTimeS / dtS needs 20000000 steps; the limit is 10000000."],
    [
      "over the CPU budget",
      { grid: { lengthUm: [100, 100], cells: [512, 512] }, endTimeS: 1000 },
      "grid.cells",
      `grid.cells: 262144 cells × 2 species × 10000 steps = 5242880000 cell-steps; one run may take at most ${RUN_WORK_LIMIT} (256² cells × 2 species × 20000 steps, about 103 s on this server). Use fewer cells or a shorter endTimeS.`,
    ],
    [
      "too many snapshot values",
      { grid: { lengthUm: [100, 100], cells: [256, 256] }, endTimeS: 10, snapshots: 200 },
      "snapshots",
      "snapshots: 200 snapshots of 65536 cells × 2 species keep 26214400 values; the limit is 16777216. Ask for fewer snapshots or fewer cells.",
    ],
  ])("refuses %s with the field and the limit", (_what, change, field, message) => {
    expect(refusal(() => plan(change as Partial<RunRequest>))).toEqual({ field, message });
  });

  it("reads the gradient only after the instability check, so a stable state is reported first", () => {
    let read = 0;
    const gradient = {
      parameter: "a",
      readShape: () => {
        read++;
        return { kind: "linear" as const, from: 0.08, to: 0.12 };
      },
    };
    expect(refusal(() => plan({ parameters: { d: 5 }, gradient })).field).toBe("parameters");
    expect(read).toBe(0);
    const { spec, plan: p } = plan({ gradient });
    expect(read).toBe(1);
    expect(spec.spatialParameters).toEqual({ a: { kind: "linear", axis: "x", fromValue: 0.08, toValue: 0.12 } });
    expect(p.gradientPrediction!.positions).toHaveLength(101);
  });
});

describe("planRun: a box large against the pattern", () => {
  // γ = 179.5 is about the demo fit's γ for its control condition; with a = 0.1, b = 0.9, d = 20 the
  // fastest wavelength 2π/k* is below one model length (computed by the stability core, which the
  // tests compare with), so a 100 × 100 box holds more admissible modes than are counted.
  const big = () => plan({ parameters: { a: 0.1, b: 0.9, d: 20, gamma: 179.5 }, endTimeS: 8 });

  it("is planned, not refused for counting more admissible modes than the limit; 2π/k* stands alone", () => {
    const { plan: p } = big();
    const wavelength = computeDispersion(schnakenberg, { a: 0.1, b: 0.9, d: 20, gamma: 179.5 }).fastest!.wavelength;
    expect(p.prediction!.wavelength).toBeCloseTo(wavelength, 12);
    expect(p.prediction!.domainMode).toBeNull();
  });

  it("warns that 64 cells over 100 model lengths do not resolve the pattern (fewer than 4 cells per 2π/k*)", () => {
    const { plan: p } = big();
    const cellsPerWavelength = p.prediction!.wavelength / (100 / 64);
    expect(cellsPerWavelength).toBeLessThan(4);
    expect(p.warnings.join(" ")).toContain(
      `The grid has ${cellsPerWavelength.toPrecision(2)} cells per predicted wavelength`,
    );
  });

  it("gives no such warning at 8 wavelengths across on 64 cells", () => {
    const wavelength = computeDispersion(schnakenberg, { a: 0.1, b: 0.9, d: 20, gamma: 179.5 }).fastest!.wavelength;
    const side = 8 * wavelength;
    const { plan: p } = plan({
      parameters: { a: 0.1, b: 0.9, d: 20, gamma: 179.5 },
      grid: { lengthUm: [side, side], cells: [64, 64] },
      endTimeS: 8,
    });
    expect(p.warnings.join(" ")).not.toContain("cells per predicted wavelength");
    expect(p.prediction!.domainMode).not.toBeNull();
  });
});
