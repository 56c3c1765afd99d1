import { describe, expect, it } from "vitest";
import { getCatalogueKinetics, KineticsInputError } from "@/lib/kinetics";
import { computeMapRows, computeTuringMap, planTuringMap, type TuringMapOptions } from "@/lib/stability";

const k = getCatalogueKinetics("schnakenberg");
const ok: TuringMapOptions = { x: { name: "a", min: 0.1, max: 0.3, n: 10 }, y: { name: "d", min: 5, max: 50, n: 10 } };

function failure(patch: Partial<TuringMapOptions>) {
  try {
    computeTuringMap(k, { ...ok, ...patch });
  } catch (err) {
    const e = err as KineticsInputError;
    return { type: e.name, field: e.field, message: e.message };
  }
  throw new Error("expected a throw");
}

describe("Turing map errors", () => {
  it.each([
    [
      { x: { name: "a", min: 0, max: 1, n: 1001 }, y: { name: "d", min: 1, max: 2, n: 1000 } },
      "KineticsLimitError",
      "x.n",
      "The map has 1001000 cells; the limit is 1000000.",
    ],
    [
      { wavenumbers: 1000, x: { name: "a", min: 0, max: 1, n: 1000 }, y: { name: "d", min: 1, max: 2, n: 1000 } },
      "KineticsLimitError",
      "wavenumbers",
      "The map needs 1000000000 dispersion evaluations (cells × wavenumbers); the limit is 500000000.",
    ],
    [
      { y: { name: "a", min: 0.1, max: 0.2, n: 5 } },
      "KineticsInputError",
      "y.name",
      'The two axes sweep the same parameter "a"; choose two different parameters.',
    ],
    [
      { x: { name: "q", min: 0, max: 1, n: 5 } },
      "KineticsInputError",
      "x.name",
      'Unknown parameter "q"; this kinetics has: gamma, a, b, d.',
    ],
    [
      { x: { name: "a", min: -1, max: 1, n: 5 } },
      "KineticsInputError",
      "x.min",
      "x.min = -1 is outside the range of a [0, 100].",
    ],
    [
      { x: { name: "a", min: 0, max: 1, n: 5, scale: "log" } },
      "KineticsInputError",
      "x.min",
      "x.min must be positive on a log axis (got 0).",
    ],
    [{ x: { name: "a", min: 0.5, max: 0.1, n: 5 } }, "KineticsInputError", "x.max", "x.max must be larger than x.min."],
    [
      { x: { name: "a", min: Number.NaN, max: 0.1, n: 5 } },
      "KineticsInputError",
      "x.min",
      "x.min must be a finite number (got NaN).",
    ],
    [
      { y: { name: "d", min: 1, max: 2, n: 1.5 } },
      "KineticsInputError",
      "y.n",
      "y.n must be an integer from 2 to 1000000 (got 1.5).",
    ],
    [
      { wavenumbers: 8 },
      "KineticsInputError",
      "wavenumbers",
      "wavenumbers must be an integer from 16 to 2000 (got 8).",
    ],
    [
      { target: { wavelength: -3, tolerance: 1 } },
      "KineticsInputError",
      "target.wavelength",
      "target.wavelength must be a positive finite number (got -3).",
    ],
  ] as const)("%j → %s", (patch, type, field, message) => {
    expect(failure(patch as Partial<TuringMapOptions>)).toEqual({ type, field, message });
  });

  it("stops at the time limit with a clear error instead of running on", () => {
    const plan = planTuringMap(k, { ...ok, timeLimitMs: 10 });
    expect(() => computeMapRows(k, plan, 0, 10, Date.now() - 1000)).toThrow(
      "The Turing map exceeded its time limit of 10 ms.",
    );
  });
});
