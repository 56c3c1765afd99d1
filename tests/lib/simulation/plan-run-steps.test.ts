/** What a verification run's plan says about its time steps and when it stops (lib/simulation/plan-run-spec.ts). */
import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import {
  planRun,
  planRunSteadyState,
  SimulationOptionError,
  type RunPlanContext,
  type RunRequest,
} from "@/lib/simulation";

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
  threads: 1,
};
const plan = (change: Partial<RunRequest> = {}) => planRun(planRunSteadyState({ ...base, ...change }), context);

describe("a run's time steps and stop", () => {
  it("by default: adaptive steps with tolerance 1e-3, stops when stationary, the criterion stated with its numbers", () => {
    const { spec, plan: p } = plan();
    expect(spec.adaptive).toEqual({ tolerance: 1e-3 });
    expect(spec.stopWhenStationary).toBe(true);
    expect(p.adaptive!.tolerance).toBe(1e-3);
    expect(p.adaptive!.rule).toMatch(/^ETD2RK with embedded ETD1 \(Cox & Matthews 2002\)/);
    // ρ = 1 for Schnakenberg a = 0.1, b = 0.9 (|λ|² = det J = 1, closed form): window 10, tolerance 1e-5.
    expect(p.stationarity).toBe(
      "stops when ‖c(t) − c(t − W)‖₂ / (‖c(t)‖₂ · W) < 0.00001 per time unit, over windows W = 10 time units (10/ρ) of simulated time",
    );
  });

  it("fixed steps when asked, or with a first-order scheme; a tolerance as given; no stop when asked", () => {
    expect(plan({ timeStepping: "fixed" }).spec.adaptive).toBeUndefined();
    expect(plan({ scheme: "implicit-euler" }).plan.adaptive).toBeNull();
    expect(plan({ tolerance: 1e-4 }).spec.adaptive).toEqual({ tolerance: 1e-4 });
    expect(plan({ stopWhenStationary: false }).plan.stationarity).toMatch(/^does not stop when /);
  });

  it("refuses adaptive steps with a first-order scheme, naming the field", () => {
    try {
      plan({ timeStepping: "adaptive", scheme: "implicit-euler" });
      throw new Error("expected a refusal");
    } catch (e) {
      expect(e).toBeInstanceOf(SimulationOptionError);
      expect((e as SimulationOptionError).field).toBe("timeStepping");
      expect((e as Error).message).toBe(
        "timeStepping: adaptive steps need the scheme etd2 (ETD2RK with an embedded ETD1 error estimate); implicit-euler takes fixed steps.",
      );
    }
  });
});
