import { describe, expect, it } from "vitest";
import { getCatalogueKinetics, resolveParameters } from "@/lib/kinetics";
import {
  createReactionSystemFromKinetics,
  readKineticsDiffusion,
  readKineticsSteadyState,
  schnakenbergReaction,
  simulateReactionDiffusion,
} from "@/lib/simulation";

describe("adapter to the kinetics engine's CompiledKinetics", () => {
  const k = getCatalogueKinetics("schnakenberg");
  const p = resolveParameters(k, { gamma: 2, a: 0.1, b: 0.9, d: 10 });
  const params = { gamma: 2, a: 0.1, b: 0.9, d: 10 };

  it("steady state and diffusion come from the kinetics (u* = a + b, v* = b/(a + b)², Murray 2003 eq. 2.39)", () => {
    expect(readKineticsSteadyState(k, p)).toEqual([1, 0.9]);
    expect(readKineticsDiffusion(k, p)).toEqual([1, 10]);
  });

  it("gives bit-identical runs to the hand-written Schnakenberg system, also with a spatial parameter", () => {
    const options = {
      grid: { lengthUm: [20, 20], cells: [16, 16] },
      diffusionUm2PerS: [1, 10],
      params,
      spatialParams: { a: { kind: "linear" as const, fromValue: 0.05, toValue: 0.15 } },
      initial: { kind: "steady-state-noise" as const, steadyState: [1, 0.9], seed: "adapter" },
      endTimeS: 5,
    };
    const a = simulateReactionDiffusion(createReactionSystemFromKinetics(k), options);
    const b = simulateReactionDiffusion(schnakenbergReaction, options);
    expect(a.speciesNames).toEqual(["u", "v"]);
    expect(a.timeStep.dtS).toBe(b.timeStep.dtS);
    for (let s = 0; s < 2; s++) expect(Array.from(a.fields[s])).toEqual(Array.from(b.fields[s]));
  });
});
