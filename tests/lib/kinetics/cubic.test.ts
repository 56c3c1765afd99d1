import { describe, expect, it } from "vitest";
import { solveCubicReal, solveQuadraticReal } from "@/lib/kinetics/cubic";

describe("solveCubicReal", () => {
  // Roots chosen by hand, polynomial expanded from its factors (algebra, no source needed).
  it.each([
    { roots: [1, 2, 3], coef: [1, -6, 11, -6] },
    { roots: [-2, 0.5, 4], coef: [2, -5, -14, 8] }, // 2(x + 2)(x − 0.5)(x − 4)
    { roots: [-1e-3, 1e-3, 1e3], coef: [1, -1e3, -1e-6, 1e-3] },
  ])("three real roots $roots", ({ roots, coef }) => {
    const out = new Float64Array(3);
    expect(solveCubicReal(coef[0], coef[1], coef[2], coef[3], out)).toBe(3);
    roots.forEach((r, i) => expect(out[i]).toBeCloseTo(r, 9));
  });

  it("one real root for x³ + x + 2 = (x + 1)(x² − x + 2)", () => {
    const out = new Float64Array(3);
    expect(solveCubicReal(1, 0, 1, 2, out)).toBe(1);
    expect(out[0]).toBeCloseTo(-1, 12);
  });

  it("falls back to the quadratic when the cubic coefficient vanishes", () => {
    const out = new Float64Array(3);
    expect(solveCubicReal(0, 1, -3, 2, out)).toBe(2);
    expect([out[0], out[1]]).toEqual([1, 2]);
    expect(solveQuadraticReal(1, 0, 1, out)).toBe(0);
  });
});
