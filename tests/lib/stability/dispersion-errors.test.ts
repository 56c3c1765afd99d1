import { describe, expect, it } from "vitest";
import {
  compileKinetics,
  getCatalogueKinetics,
  KineticsAnalysisError,
  KineticsInputError,
  KineticsLimitError,
} from "@/lib/kinetics";
import { computeDispersion, type DispersionOptions } from "@/lib/stability";

const schnakenberg = getCatalogueKinetics("schnakenberg");

function failure(run: () => unknown) {
  try {
    run();
  } catch (err) {
    const e = err as KineticsInputError;
    return { type: e.constructor.name, field: e.field, message: e.message };
  }
  throw new Error("expected a throw");
}
const disp =
  (set: Record<string, number>, options: DispersionOptions = {}) =>
  () =>
    computeDispersion(schnakenberg, set, options);

describe("computeDispersion errors", () => {
  it.each([
    [{ a: -1 }, {}, "KineticsInputError", "parameters.a", "Parameter a = -1 is outside its allowed range [0, 100]."],
    [{ a: Number.NaN }, {}, "KineticsInputError", "parameters.a", "Parameter a must be a finite number (got NaN)."],
    [{ d: Infinity }, {}, "KineticsInputError", "parameters.d", "Parameter d must be a finite number (got Infinity)."],
    [{ q: 1 }, {}, "KineticsInputError", "parameters.q", 'Unknown parameter "q"; this kinetics has: gamma, a, b, d.'],
    [{}, { gridSize: 3 }, "KineticsInputError", "gridSize", "gridSize must be an integer from 16 to 100000 (got 3)."],
    [{}, { kMax: -1 }, "KineticsInputError", "kMax", "kMax must be a positive finite number (got -1)."],
    [
      {},
      { lengthScaleUm: 0 },
      "KineticsInputError",
      "lengthScaleUm",
      "lengthScaleUm must be a positive finite number (got 0).",
    ],
    [
      {},
      { steadyState: 3 },
      "KineticsInputError",
      "steadyState",
      'steadyState must be "auto" or an index from 0 to 0 (got 3).',
    ],
    [
      {},
      { domain: { kind: "interval", length: 10, units: "um" } },
      "KineticsInputError",
      "domain.units",
      'Domain sizes in µm need a length scale (lengthScaleUm) for a non-dimensional kinetics; give one or use units "model".',
    ],
    [
      {},
      { domain: { kind: "sphere", radius: -2 } },
      "KineticsInputError",
      "domain.radius",
      "domain.radius must be a positive finite number (got -2).",
    ],
    [
      {},
      { domain: { kind: "interval", length: 1e9 } },
      "KineticsLimitError",
      "domain",
      "The domain has more than 200000 admissible modes in the unstable range; it is effectively unbounded, use the unbounded result.",
    ],
    [
      { a: 0, b: 0 },
      {},
      "KineticsAnalysisError",
      "steadyState",
      "No homogeneous steady state: the closed form of Schnakenberg has no non-negative solution for these parameters.",
    ],
  ] as const)("%j %j → %s %s", (set, options, type, field, message) => {
    expect(failure(disp(set, options as DispersionOptions))).toEqual({ type, field, message });
  });

  it("a custom kinetics without a steady state fails after the seeded Newton starts, without hanging", () => {
    const k = compileKinetics({
      name: "none",
      species: ["u", "v"],
      parameters: [],
      reactions: ["1 + u^2", "-v"],
      diffusion: [1, 1],
    });
    expect(failure(() => computeDispersion(k, {}))).toEqual({
      type: "KineticsAnalysisError",
      field: "steadyState",
      message:
        "No homogeneous steady state: Newton's method from 53 seeded starting points found no non-negative solution.",
    });
    expect(new KineticsAnalysisError("x", "y").code).toBe("cannot_analyse");
    expect(new KineticsLimitError("x", "y").code).toBe("too_large");
  });

  it("refuses singular or ill-posed diffusion matrices", () => {
    const zero = compileKinetics({
      name: "z",
      species: ["u", "v"],
      parameters: [{ name: "D", default: 0 }],
      reactions: ["1 - u", "u - v"],
      diffusion: [1, "D"],
    });
    expect(failure(() => computeDispersion(zero, {}))).toEqual({
      type: "KineticsInputError",
      field: "diffusion",
      message: "Diffusivity of v must be positive (got 0).",
    });
    const cross = compileKinetics({
      name: "c",
      species: ["u", "v"],
      parameters: [],
      reactions: ["1 - u", "u - v"],
      diffusion: [
        [1, 2],
        [2, 1],
      ],
    });
    expect(failure(() => computeDispersion(cross, {}))).toEqual({
      type: "KineticsInputError",
      field: "diffusion",
      message:
        "The diffusion matrix must have eigenvalues with positive real part (smallest is -1.00000); otherwise short waves grow without bound.",
    });
  });
});
