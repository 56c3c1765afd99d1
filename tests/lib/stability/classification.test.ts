import { describe, expect, it } from "vitest";
import { compileKinetics, getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";

const brusselator = getCatalogueKinetics("brusselator");

describe("classification (SCIENCE.md §1)", () => {
  it("Hopf: Brusselator past b_H = 1 + a² with equal diffusivities (Prigogine & Lefever 1968)", () => {
    const a = 2,
      b = 5.5; // b_H = 5; with Du = Dv no Turing band exists (needs Dv/Du > 1)
    const r = computeDispersion(brusselator, { a, b, Du: 1, Dv: 1 });
    expect(r.classification.classes).toEqual(["hopf"]);
    const e0 = r.steadyStates[0].eigenvalues[0];
    // J = [[b − 1, a²], [−b, −a²]]: Re λ = (b − 1 − a²)/2, |Im λ| = √(det − Re²), det = a² (algebra)
    expect(e0.re).toBeCloseTo((b - 1 - a * a) / 2, 12);
    expect(Math.abs(e0.im)).toBeCloseTo(Math.sqrt(a * a - ((b - 1 - a * a) / 2) ** 2), 12);
    expect(r.fastest).toBeNull();
    expect(r.bands[0].kLow).toBe(0);
  });

  it("Turing + Hopf together: Brusselator with b above both thresholds", () => {
    const r = computeDispersion(brusselator, { a: 1.5, b: 3.4, Du: 1, Dv: 10 }); // b_c ≈ 2.17, b_H = 3.25
    // One definition of Turing (stable at k = 0; Murray 2003 ch. 2): a k > 0 peak on top of Hopf is a mixed class of its own.
    expect(r.classification.classes).toEqual(["turing-hopf"]);
    expect(r.classification.label).toBe("Turing with Hopf (k = 0)");
    expect(r.fastest!.kind).toBe("turing");
  });

  it("stable: Schnakenberg below its critical ratio (d = 5 < d_c ≈ 8.57, Murray 2003 §2.4)", () => {
    const r = computeDispersion(getCatalogueKinetics("schnakenberg"), { d: 5 });
    expect(r.classification.classes).toEqual(["stable"]);
    expect(r.bands).toEqual([]);
    expect(Math.max(...r.curve.sigma)).toBeLessThan(0);
    expect(r.turingConditions!.allSatisfied).toBe(false);
  });

  it("unstable at k = 0: a saddle (FitzHugh–Nagumo with b = 2, det J = ε(1 − b) < 0 at u* = 0)", () => {
    const r = computeDispersion(getCatalogueKinetics("fitzhugh-nagumo"), { b: 2 }, { steadyState: 1 });
    expect(r.steadyState.values.u).toBeCloseTo(0, 12);
    // A saddle is unstable at k = 0 whatever grows at k > 0; with a k > 0 peak it is its own mixed class.
    expect(r.classification.classes).toHaveLength(1);
    expect(["unstable-k0", "peak-unstable-k0"]).toContain(r.classification.classes[0]);
  });

  it("wave (k > 0): the three-species catalogue model at its defaults, and a linear constructed case", () => {
    const r = computeDispersion(getCatalogueKinetics("brusselator-three-species"), {});
    expect(r.classification.classes).toEqual(["wave"]);
    expect(r.fastest!.imSigmaStar).toBeGreaterThan(0.1);
    expect(r.fastest!.kStar).toBeGreaterThan(0);
    expect(r.steadyStates[0].stableWithoutDiffusion).toBe(true);
    // The same Jacobian typed as linear kinetics around its steady state must give the same answer.
    const J = r.jacobian,
      D = r.diffusion,
      ss = Object.values(r.steadyState.values);
    const sp = ["x", "y", "z"];
    const lin = compileKinetics({
      name: "linearised",
      species: sp,
      parameters: [],
      reactions: J.map((row) => row.map((v, j) => `(${v}) * (${sp[j]} - ${ss[j]})`).join(" + ")),
      diffusion: D.map((row, i) => row[i]),
    });
    const r2 = computeDispersion(lin, {});
    expect(r2.classification.classes).toEqual(["wave"]);
    expect(r2.fastest!.kStar).toBeCloseTo(r.fastest!.kStar, 8);
    expect(r2.fastest!.imSigmaStar).toBeCloseTo(r.fastest!.imSigmaStar, 8);
  });

  it.each([
    ["schnakenberg", {}],
    ["gierer-meinhardt", { d: 5 }],
    ["lengyel-epstein", { d: 0.1 }],
    ["thomas", {}],
    ["brusselator", { b: 2 }],
    ["fitzhugh-nagumo", { d: 5 }],
  ] as const)("%s %j: closed-form Turing conditions agree with the numerical class", (id, set) => {
    const r = computeDispersion(getCatalogueKinetics(id), set);
    expect(r.turingConditions!.allSatisfied).toBe(r.classification.classes.includes("turing"));
    if (r.fastest) {
      // the unstable band contains k* and its edges are zeros of σ_max
      const band = r.bands.find((b) => b.kLow < r.fastest!.kStar && r.fastest!.kStar < b.kHigh);
      expect(band).toBeDefined();
    }
  });
});
