import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";
import { findRootBracketed } from "@/lib/stability/roots";

const brusselator = getCatalogueKinetics("brusselator");
const schnakenberg = getCatalogueKinetics("schnakenberg");

/** Largest growth rate over k > 0 (0 when none of the peaks grows). */
const peakGrowth = (r: ReturnType<typeof computeDispersion>) =>
  Math.max(...r.curve.sigma.slice(1), r.fastest?.sigmaStar ?? -Infinity);

describe("Brusselator Turing threshold", () => {
  // b_c = (1 + a√(Du/Dv))², k_c² = a/√(Du Dv): Prigogine & Lefever (1968); also Nicolis G. &
  // Prigogine I. (1977) Self-Organization in Nonequilibrium Systems, Wiley, ch. 7 (from memory).
  it.each([
    { a: 1.5, Du: 1, Dv: 10 },
    { a: 3, Du: 1, Dv: 8 },
    { a: 2, Du: 0.5, Dv: 20 },
  ])("a=$a Du=$Du Dv=$Dv", ({ a, Du, Dv }) => {
    const bc = (1 + a * Math.sqrt(Du / Dv)) ** 2;
    const kc = Math.sqrt(a / Math.sqrt(Du * Dv));
    const bNumeric = findRootBracketed(
      (b) => peakGrowth(computeDispersion(brusselator, { a, b, Du, Dv })),
      0.5 * bc,
      Math.min(1 + a * a, 1.5 * bc) - 1e-9,
      1e-12,
    );
    expect(bNumeric).toBeCloseTo(bc, 7);
    const r = computeDispersion(brusselator, { a, b: bc * (1 + 1e-8), Du, Dv });
    expect(r.classification.classes).toEqual(["turing"]);
    expect(r.fastest!.kStar).toBeCloseTo(kc, 3);
    // the closed-form threshold wavenumber, beside the numerical one
    expect(r.turingConditions!.detMinimumWavenumber!).toBeCloseTo(kc, 6);
  });
});

describe("Schnakenberg critical diffusion ratio", () => {
  // Murray (2003) Mathematical Biology II §2.4: for Schnakenberg, f_u = (b − a)/(a + b),
  // f_v = (a + b)², g_u = −2b/(a + b), g_v = −(a + b)² (times γ); d_c solves
  // f_u² d² + 2(2 f_v g_u − f_u g_v) d + g_v² = 0 with d f_u + g_v > 0.
  it.each([
    { a: 0.1, b: 0.9 },
    { a: 0.05, b: 1.2 },
    { a: 0.2, b: 1.5 },
  ])("a=$a b=$b", ({ a, b }) => {
    const s = a + b,
      fu = (b - a) / s,
      fv = s * s,
      gu = (-2 * b) / s,
      gv = -s * s;
    const A = fu * fu,
      B = 2 * (2 * fv * gu - fu * gv),
      C = gv * gv;
    const dc = [(-B + Math.sqrt(B * B - 4 * A * C)) / (2 * A), (-B - Math.sqrt(B * B - 4 * A * C)) / (2 * A)].find(
      (d) => d * fu + gv > 0,
    )!;
    const r = computeDispersion(schnakenberg, { a, b, d: 2 * dc });
    expect(r.turingConditions!.criticalRatio!).toBeCloseTo(dc, 10);
    // numerical threshold: the d at which the peak growth crosses zero
    const dNumeric = findRootBracketed(
      (d) => peakGrowth(computeDispersion(schnakenberg, { a, b, d })),
      0.5 * dc,
      2 * dc,
      1e-12,
    );
    expect(dNumeric).toBeCloseTo(dc, 6);
  });

  it("a = 0.1, b = 0.9 gives d_c ≈ 8.5676 (roots of 0.64 d² − 5.6 d + 1, hand-computed from Murray's quadratic)", () => {
    const r = computeDispersion(schnakenberg, {});
    expect(r.turingConditions!.criticalRatio!).toBeCloseTo((5.6 + Math.sqrt(5.6 ** 2 - 4 * 0.64)) / 1.28, 12);
    expect(r.turingConditions!.unstableWhenRatio).toBe("above");
  });
});

describe("Thomas kinetics with Murray's parameter values", () => {
  // Murray (2003) §2.4 quotes d_c ≈ 27.03 for a = 150, b = 100, α = 1.5, ρ = 13, K = 0.05 (from memory).
  it("has a critical ratio near 27.0", () => {
    const r = computeDispersion(getCatalogueKinetics("thomas"), {});
    expect(Math.abs(r.turingConditions!.criticalRatio! - 27.03)).toBeLessThan(0.05);
  });
});
