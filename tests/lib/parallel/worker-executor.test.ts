import { describe, expect, it } from "vitest";
import { schnakenbergReaction, simulateReactionDiffusion, type SimulationOptions } from "@/lib/simulation";
import { createWorkerExecutor } from "@/lib/parallel";

describe("worker-thread executor", () => {
  it.each(["etd2", "implicit-euler"] as const)(
    "%s: same bits as the serial executor (same code per species)",
    (scheme) => {
      const options: SimulationOptions = {
        grid: { lengthUm: [30, 30], cells: [32, 16] },
        diffusionUm2PerS: [1, 10],
        params: { a: 0.1, b: 0.9, gamma: 1 },
        initial: { kind: "steady-state-noise", steadyState: [1, 0.9], seed: "parallel" },
        endTimeS: 5,
        scheme,
      };
      const serial = simulateReactionDiffusion(schnakenbergReaction, options);
      const executor = createWorkerExecutor({ workers: 1 });
      try {
        const parallel = simulateReactionDiffusion(schnakenbergReaction, { ...options, executor });
        expect(parallel.steps).toBe(serial.steps);
        for (let s = 0; s < 2; s++) expect(Array.from(parallel.fields[s])).toEqual(Array.from(serial.fields[s]));
      } finally {
        executor.dispose();
      }
    },
  );
});

describe("worker-thread executor, adaptive steps", () => {
  it("ETD2RK with adaptive steps: same bits and the same steps as the serial executor", () => {
    const options: SimulationOptions = {
      grid: { lengthUm: [30, 30], cells: [32, 16] },
      diffusionUm2PerS: [1, 10],
      params: { a: 0.1, b: 0.9, gamma: 1 },
      initial: { kind: "steady-state-noise", steadyState: [1, 0.9], seed: "parallel" },
      endTimeS: 20,
      adaptive: {},
    };
    const serial = simulateReactionDiffusion(schnakenbergReaction, options);
    const executor = createWorkerExecutor({ workers: 1 });
    try {
      const parallel = simulateReactionDiffusion(schnakenbergReaction, { ...options, executor });
      expect(parallel.adaptive).toEqual(serial.adaptive);
      for (let s = 0; s < 2; s++) expect(Array.from(parallel.fields[s])).toEqual(Array.from(serial.fields[s]));
    } finally {
      executor.dispose();
    }
  });
});

describe("awaitWord", () => {
  it("returns once the word holds the value, and throws when a worker set the failure word", async () => {
    const { awaitWord } = await import("@/lib/parallel");
    const ctrl = new Int32Array(new SharedArrayBuffer(16));
    ctrl[1] = 5;
    expect(() => awaitWord(ctrl, 1, 5, 3)).not.toThrow();
    ctrl[3] = 1;
    expect(() => awaitWord(ctrl, 1, 6, 3)).toThrow(
      "A simulation worker thread failed (its error is printed above); the run cannot continue.",
    );
  });
});
