import { describe, expect, it } from "vitest";
import { CONVERGED_REASONS, fitCurve, solveLeastSquares } from "@/lib/fitting";
import { createCurveProblem } from "@/lib/fitting/fit-curve";

// Invented straight-line data with unequal uncertainties (common practice, no source).
const LINE = { x: [0, 1, 2, 3, 4, 5], y: [1.1, 2.9, 5.2, 6.8, 9.1, 11.2], sigma: [0.1, 0.2, 0.1, 0.3, 0.2, 0.1] };

/** Weighted straight-line fit in closed form (Bevington & Robinson 2003, Data Reduction and Error Analysis, §6.3). */
function closedFormLine(d: typeof LINE) {
  let S = 0,
    Sx = 0,
    Sy = 0,
    Sxx = 0,
    Sxy = 0;
  d.x.forEach((x, i) => {
    const w = 1 / d.sigma[i] ** 2;
    S += w;
    Sx += w * x;
    Sy += w * d.y[i];
    Sxx += w * x * x;
    Sxy += w * x * d.y[i];
  });
  const D = S * Sxx - Sx * Sx;
  return { a: (Sxx * Sy - Sx * Sxy) / D, b: (S * Sxy - Sx * Sy) / D, sa: Math.sqrt(Sxx / D), sb: Math.sqrt(S / D) };
}

const line = { value: (p: readonly number[], x: number) => p[0] + p[1] * x };

describe("solveLeastSquares: known answers", () => {
  it("reproduces the closed-form weighted straight-line fit", () => {
    const ref = closedFormLine(LINE);
    const f = fitCurve(LINE, line, { start: [0, 1], profiles: false });
    expect(f.solution.converged).toBe(true);
    expect(f.solution.params[0]).toBeCloseTo(ref.a, 9);
    expect(f.solution.params[1]).toBeCloseTo(ref.b, 9);
    expect(f.analysis.covariance.standardErrors[0]).toBeCloseTo(ref.sa, 7);
    expect(f.analysis.covariance.standardErrors[1]).toBeCloseTo(ref.sb, 7);
  });

  it("an analytic gradient gives the same answer as central differences", () => {
    const withGradient = { ...line, gradient: (_p: readonly number[], x: number) => [1, x] };
    const a = fitCurve(LINE, line, { start: [0, 1], profiles: false });
    const b = fitCurve(LINE, withGradient, { start: [0, 1], profiles: false });
    b.solution.params.forEach((v, j) => expect(v).toBeCloseTo(a.solution.params[j], 9));
  });
});

describe("solveLeastSquares: round trips", () => {
  // Noise-free data from y = A·exp(−k·x): the fit must return the generating parameters.
  const A = 2000;
  const k = 3e-4;
  const xs = Array.from({ length: 12 }, (_, i) => i * 1000);
  const decay = { x: xs, y: xs.map((x) => A * Math.exp(-k * x)) };
  const model = { value: (p: readonly number[], x: number) => p[0] * Math.exp(-p[1] * x) };

  it("recovers the generating parameters of noise-free data", () => {
    const f = fitCurve(decay, model, { start: [1000, 1e-4], profiles: false });
    expect(f.solution.converged).toBe(true);
    expect(f.solution.params[0]).toBeCloseTo(A, 6);
    expect(f.solution.params[1] / k).toBeCloseTo(1, 9);
  });

  it("log-scaled parameters spanning decades reach the same answer from two decades away", () => {
    const f = fitCurve(decay, model, {
      start: [20, 3e-6],
      lower: [1e-3, 1e-9],
      upper: [1e6, 1],
      log: [true, true],
      profiles: false,
    });
    expect(f.solution.converged).toBe(true);
    expect(f.solution.params[1] / k).toBeCloseTo(1, 8);
  });

  it("holds a parameter on its bound when the unconstrained optimum lies beyond it", () => {
    // y = a·x with data of slope 2 and a ≤ 1: the constrained optimum is a = 1 (convexity of χ² in a).
    const f = fitCurve(
      { x: [1, 2, 3], y: [2, 4, 6] },
      { value: (p, x) => p[0] * x },
      { start: [0.5], upper: [1], profiles: false },
    );
    expect(f.solution.params[0]).toBe(1);
    expect(f.solution.atBound).toEqual([0]);
    expect(f.solution.converged).toBe(true);
    expect(f.analysis.warnings[0]).toMatch(/ended on its bound/);
  });
});

describe("solveLeastSquares: several starts", () => {
  // y = sin(ω·x): χ²(ω) has many local minima; the given start ω = 0.6 sits in a wrong basin.
  const xs = Array.from({ length: 40 }, (_, i) => i * 0.25);
  const data = { x: xs, y: xs.map((x) => Math.sin(3 * x)) };
  const problem = createCurveProblem(data, { value: (p, x) => Math.sin(p[0] * x) }, 1);

  it("the given start alone ends in a local minimum, seeded starts in the box find ω = 3", () => {
    const alone = solveLeastSquares(problem, { start: [0.6], lower: [0.1], upper: [5] });
    expect(Math.abs(alone.params[0] - 3)).toBeGreaterThan(0.1);
    const many = solveLeastSquares(problem, { start: [0.6], lower: [0.1], upper: [5], seededStarts: 12 });
    expect(many.params[0]).toBeCloseTo(3, 8);
    expect(many.starts).toHaveLength(13);
    expect(many.starts[many.bestStart].chiSquare).toBe(many.chiSquare);
    expect(many.chiSquare).toBeLessThan(alone.chiSquare);
  });

  it("seeded starts are deterministic, lie within the bounds and change with the seed", () => {
    const a = solveLeastSquares(problem, { start: [0.6], lower: [0.1], upper: [5], seededStarts: 5, seed: "s1" });
    const b = solveLeastSquares(problem, { start: [0.6], lower: [0.1], upper: [5], seededStarts: 5, seed: "s1" });
    const c = solveLeastSquares(problem, { start: [0.6], lower: [0.1], upper: [5], seededStarts: 5, seed: "s2" });
    expect(a.starts.map((s) => s.start)).toEqual(b.starts.map((s) => s.start));
    expect(a.starts.map((s) => s.start)).not.toEqual(c.starts.map((s) => s.start));
    for (const s of a.starts) expect(s.start[0] >= 0.1 && s.start[0] <= 5).toBe(true);
    expect(a.starts[0].origin).toBe("given");
    expect(a.starts[1].origin).toBe("seeded");
  });
});

describe("solveLeastSquares: convergence report", () => {
  it("always running the library stage first is reported and still converges", () => {
    const f = fitCurve(LINE, line, { start: [0, 1], libraryStage: "always", profiles: false });
    expect(f.solution.iterations.library).toBeGreaterThan(0);
    expect(f.solution.starts[0].stages).toBe("library+polish");
    expect(CONVERGED_REASONS).toContain(f.solution.reason);
    expect(f.solution.params[1]).toBeCloseTo(closedFormLine(LINE).b, 8);
  });

  it("an iteration cap too small to converge is reported as max-iterations, not converged", () => {
    const xs = Array.from({ length: 10 }, (_, i) => i);
    const data = { x: xs, y: xs.map((x) => 5 * Math.exp(-0.3 * x)) };
    const s = solveLeastSquares(createCurveProblem(data, { value: (p, x) => p[0] * Math.exp(-p[1] * x) }, 2), {
      start: [1, 2],
      libraryStage: "off",
      polish: { maxIterations: 1 },
    });
    expect(s.reason).toBe("max-iterations");
    expect(s.converged).toBe(false);
  });
});
