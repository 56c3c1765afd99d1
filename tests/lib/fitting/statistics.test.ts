import { describe, expect, it } from "vitest";
import { computeAicc, computeAkaikeWeights, computeBic, fitCurve, PROFILE_DELTA_95 } from "@/lib/fitting";

// Invented data (common practice, no source).
const LINE = { x: [0, 1, 2, 3, 4, 5], y: [1.1, 2.9, 5.2, 6.8, 9.1, 11.2], sigma: [0.1, 0.2, 0.1, 0.3, 0.2, 0.1] };
const line = { value: (p: readonly number[], x: number) => p[0] + p[1] * x };

describe("information criteria", () => {
  it("AICc and BIC follow their formulas", () => {
    // AICc = χ² + 2p + 2p(p+1)/(n−p−1), BIC = χ² + p ln n (Burnham & Anderson 2002; Schwarz 1978).
    expect(computeAicc(10, 12, 3)).toBeCloseTo(10 + 6 + 24 / 8, 12);
    expect(computeBic(10, 12, 3)).toBeCloseTo(10 + 3 * Math.log(12), 12);
    expect(computeAicc(1, 4, 3)).toBeNull();
  });

  it("Akaike weights for Δ = 0, 2, 4 are exp(−Δ/2) normalised and sum to 1", () => {
    // wᵢ = exp(−Δᵢ/2)/Σ exp(−Δⱼ/2) (Burnham & Anderson 2002, §2.9).
    const w = computeAkaikeWeights([100, 102, 104, null]);
    const z = 1 + Math.exp(-1) + Math.exp(-2);
    expect(w[0]).toBeCloseTo(1 / z, 12);
    expect(w[1]).toBeCloseTo(Math.exp(-1) / z, 12);
    expect(w[2]).toBeCloseTo(Math.exp(-2) / z, 12);
    expect(w[3]).toBeNull();
    expect((w[0] ?? 0) + (w[1] ?? 0) + (w[2] ?? 0)).toBeCloseTo(1, 14);
  });
});

describe("covariance and profile likelihood", () => {
  it("for a linear model the 95 % profile interval is the estimate ± √3.84 standard errors", () => {
    // χ² is exactly quadratic in the parameters of a linear model, so the profile crosses
    // Δχ² = 3.84 at θ̂ ± √3.84·SE (a theorem of linear least squares).
    const f = fitCurve(LINE, line, { start: [0, 1] });
    const k = Math.sqrt(PROFILE_DELTA_95);
    f.analysis.profiles!.forEach((prof, j) => {
      const se = f.analysis.covariance.standardErrors[j]!;
      // The crossing is located to |Δχ² − 3.84| < 0.1 % of 3.84, i.e. the limit to ~1e-3 SE.
      expect(Math.abs(prof.lower.limit! - (f.solution.params[j] - k * se))).toBeLessThan(2e-3 * se);
      expect(Math.abs(prof.upper.limit! - (f.solution.params[j] + k * se))).toBeLessThan(2e-3 * se);
      expect(prof.flat).toBe(false);
    });
    expect(f.analysis.identifiability.identifiable).toBe(true);
  });

  it("√3.84 is the 97.5 % normal quantile 1.959964 (standard table value)", () => {
    expect(Math.sqrt(PROFILE_DELTA_95)).toBeCloseTo(1.959964, 6);
  });

  it("relative uncertainties scale the covariance by χ²/(n − p)", () => {
    const abs = fitCurve(LINE, line, { start: [0, 1], profiles: false });
    const rel = fitCurve(LINE, line, { start: [0, 1], profiles: false, absoluteUncertainties: false });
    const s = Math.sqrt(abs.analysis.chiSquare / (LINE.x.length - 2));
    expect(rel.analysis.covariance.standardErrors[0]! / abs.analysis.covariance.standardErrors[0]!).toBeCloseTo(s, 10);
    expect(rel.analysis.reducedChiSquare).toBeCloseTo(abs.analysis.chiSquare / 4, 12);
  });

  it("reports an interval as open-ended where the bound is reached first", () => {
    // y = a·x with a tiny true slope and large uncertainties: a = 0 is within 95 % and a ≥ 0.
    const data = { x: [1, 2, 3], y: [0.05, 0.1, 0.15], sigma: [1, 1, 1] };
    const f = fitCurve(data, { value: (p, x) => p[0] * x }, { start: [0.5], lower: [0] });
    const prof = f.analysis.profiles![0];
    expect(prof.lower.limit).toBeNull();
    expect(prof.lower.openReason).toBe("bound");
    // Upper limit: â + √3.84/√Σx² for this one-parameter linear model (theorem above).
    const se = 1 / Math.sqrt(14);
    expect(Math.abs(prof.upper.limit! - (0.05 + Math.sqrt(PROFILE_DELTA_95) * se))).toBeLessThan(2e-3 * se);
  });
});

describe("identifiability", () => {
  it("one measurement and two parameters: not identifiable, with the reason in words", () => {
    const f = fitCurve({ x: [2], y: [5] }, line, { start: [0, 1], lower: [-10, -10], upper: [10, 10] });
    expect(f.analysis.identifiability.identifiable).toBe(false);
    expect(f.analysis.identifiability.reasons[0]).toBe(
      "1 measurement cannot determine 2 free parameters: at least 3 are needed to fit and judge the fit.",
    );
    expect(f.analysis.covariance.covariance).toBeNull();
    // The valley is the line a + 2b = 5 (geometry of the single equation).
    expect(f.analysis.valley).not.toBeNull();
    for (const pt of f.analysis.valley!.points.filter((q) => q.withinConfidence))
      expect(pt.params[0] + 2 * pt.params[1]).toBeCloseTo(5, 5);
  });

  it("only the product of two parameters matters: singular Jacobian, valley a·b = const", () => {
    const xs = [1, 2, 3, 4, 5];
    const data = { x: xs, y: xs.map((x) => 6 * x), sigma: xs.map(() => 0.5) };
    const f = fitCurve(
      data,
      { value: (p, x) => p[0] * p[1] * x },
      { start: [1, 2], lower: [0.1, 0.1], upper: [20, 20] },
    );
    const id = f.analysis.identifiability;
    expect(id.identifiable).toBe(false);
    expect(id.singularRatio).toBeLessThan(1e-8);
    expect(
      id.reasons.some((r) => r.startsWith("The data cannot tell apart solutions along one combination of parameters")),
    ).toBe(true);
    // Grid a ∈ [0.1, 20]; b = 6/a stays inside [0.1, 20] for every grid point but a = 0.1.
    const inside = f.analysis.valley!.points.filter((q) => q.withinConfidence);
    expect(inside.length).toBe(20);
    for (const pt of inside) {
      expect(pt.params[0] * pt.params[1]).toBeCloseTo(6, 5);
      expect(pt.deltaChiSquare).toBeLessThan(1e-6);
    }
  });

  it("a parameter whose whole range changes χ² by less than 3.84 has a flat profile", () => {
    // y = a + 0.1·sin(b), σ = 1, 4 points: moving b changes χ² by at most 4·0.2² = 0.16.
    const data = { x: [0, 1, 2, 3], y: [1, 1.02, 0.98, 1.01], sigma: [1, 1, 1, 1] };
    const f = fitCurve(
      data,
      { value: (p) => p[0] + 0.1 * Math.sin(p[1]) },
      { start: [1, 1], lower: [-5, 0], upper: [5, 3] },
    );
    const id = f.analysis.identifiability;
    expect(id.flatParameters).toEqual([1]);
    expect(id.identifiable).toBe(false);
    expect(id.reasons.some((r) => r.includes("the data do not bound θ2"))).toBe(true);
    expect(f.analysis.valley!.parameterIndex).toBe(1);
  });
});
