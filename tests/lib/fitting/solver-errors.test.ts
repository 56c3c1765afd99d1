import { describe, expect, it } from "vitest";
import { analyseFit, fitCurve, FitError, solveLeastSquares, type LeastSquaresOptions } from "@/lib/fitting";
import { createCurveProblem } from "@/lib/fitting/fit-curve";

const problem = createCurveProblem({ x: [0, 1, 2], y: [1, 2, 3] }, { value: (p, x) => p[0] + p[1] * x }, 2);

function messageOf(options: LeastSquaresOptions): string {
  try {
    solveLeastSquares(problem, options);
  } catch (err) {
    expect(err).toBeInstanceOf(FitError);
    return (err as Error).message;
  }
  return "no error";
}

describe("solver option errors (exact messages)", () => {
  it.each([
    [{ start: [] }, "start must hold at least one parameter value."],
    [{ start: [1] }, "start must hold 2 values (one per parameter); got 1."],
    [{ start: [1, Infinity] }, "start[1] must be a finite number; got Infinity."],
    [{ start: [1, 1], lower: [0] }, "lower must hold 2 values (one per parameter); got 1."],
    [{ start: [1, 1], lower: [0, NaN] }, "lower[1] must be a number; got NaN."],
    [{ start: [1, 1], lower: [2, 0], upper: [2, 5] }, "lower[0] (2) must be below upper[0] (2)."],
    [{ start: [1, 7], lower: [0, 0], upper: [5, 5] }, "start[1] (7) must lie within [lower, upper] = [0, 5]."],
    [{ start: [1, -1], log: [false, true] }, "start[1] must be positive for a log-scaled parameter; got -1."],
    [
      { start: [1, 1], lower: [0, -1], log: [false, true] },
      "lower[1] must be 0 or more for a log-scaled parameter; got -1.",
    ],
    [{ start: [1, 1], log: [true] }, "log must hold 2 flags (one per parameter); got 1."],
    [{ start: [1, 1], seededStarts: 2.5 }, "seededStarts must be an integer from 0 to 1000; got 2.5."],
    [
      { start: [1, 1], libraryStage: "sometimes" as "off" },
      'libraryStage must be "fallback", "always" or "off"; got "sometimes".',
    ],
    [{ start: [1, 1], polish: { maxIterations: 0 } }, "polish.maxIterations must be a positive integer; got 0."],
    [{ start: [1, 1], library: { maxIterations: -3 } }, "library.maxIterations must be a positive integer; got -3."],
  ] as [LeastSquaresOptions, string][])("%j", (options, message) => {
    expect(messageOf(options)).toBe(message);
  });

  it("names the offending field", () => {
    try {
      solveLeastSquares(problem, { start: [1, 7], lower: [0, 0], upper: [5, 5] });
    } catch (err) {
      expect((err as FitError).field).toBe("start[1]");
    }
    expect.assertions(1);
  });
});

describe("curve data and analysis errors (exact messages)", () => {
  const model = { value: (p: readonly number[], x: number) => p[0] * x };
  it.each([
    [{ x: [], y: [] }, "data.y must hold at least one measurement; got none."],
    [{ x: [1], y: [1, 2] }, "data.x must hold 2 values (one per measurement); got 1."],
    [{ x: [1, 2], y: [1, 2], sigma: [1] }, "data.sigma must hold 2 values (one per measurement); got 1."],
    [{ x: [1, 2], y: [1, 2], sigma: [1, 0] }, "data.sigma[1] must be a positive finite number; got 0."],
  ])("%j", (data, message) => {
    expect(() => fitCurve(data, model, { start: [1] })).toThrow(message);
  });

  it("rejects names of the wrong length and a valley grid of 2", () => {
    const p1 = createCurveProblem({ x: [1, 2], y: [1, 2] }, model, 1);
    const s = solveLeastSquares(p1, { start: [1] });
    expect(() => analyseFit(p1, s, { names: ["a", "b"] })).toThrow(
      "names must hold 1 entries (one per parameter); got 2.",
    );
    expect(() => analyseFit(p1, s, { valleyPoints: 2 })).toThrow(
      "valleyPoints must be 0 or an integer of at least 3; got 2.",
    );
  });
});
