import { describe, expect, it } from "vitest";
import { compileKinetics, getCatalogueKinetics, resolveParameters, type KineticsDefinition } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";

const schnakenbergDefinition: KineticsDefinition = {
  name: "Schnakenberg typed by hand",
  species: ["u", "v"],
  parameters: [
    { name: "gamma", default: 1, min: 1e-6, max: 1e6 },
    { name: "a", default: 0.1, min: 0, max: 100 },
    { name: "b", default: 0.9, min: 0, max: 100 },
    { name: "d", default: 20, min: 1e-6, max: 1e6 },
  ],
  reactions: ["gamma*(a - u + u^2 v)", "gamma*(b - u^2 v)"], // implicit multiplication, as a user types it
  diffusion: [1, "d"],
};

describe("compileKinetics", () => {
  it("a hand-typed Schnakenberg reproduces the catalogue dispersion to 1e-9 (round trip, Newton instead of the closed form)", () => {
    const custom = compileKinetics(schnakenbergDefinition);
    const cat = getCatalogueKinetics("schnakenberg");
    const sets: Record<string, number>[] = [{}, { a: 0.2, b: 1.3, d: 40 }, { gamma: 50 }];
    for (const set of sets) {
      const r1 = computeDispersion(cat, set),
        r2 = computeDispersion(custom, set);
      expect(r2.steadyStates[0].method).toBe("newton");
      expect(r2.steadyState.values.u).toBeCloseTo(r1.steadyState.values.u, 9);
      expect(r2.classification.classes).toEqual(r1.classification.classes);
      expect(Math.abs(r2.fastest!.kStar - r1.fastest!.kStar)).toBeLessThan(1e-9 * r1.fastest!.kStar);
      expect(Math.abs(r2.fastest!.sigmaStar - r1.fastest!.sigmaStar)).toBeLessThan(1e-9);
      expect(r2.turingConditions!.criticalRatio!).toBeCloseTo(r1.turingConditions!.criticalRatio!, 9);
    }
  });

  it("symbolic Jacobian agrees with central differences; min/max fall back to numerical entries", () => {
    const k = compileKinetics({
      name: "saturating",
      species: ["u", "v", "w"],
      parameters: [{ name: "K", default: 2 }],
      reactions: ["u^2 / (1 + K u^2) - u + exp(-v) * w", "sqrt(u) - v + tanh(w)", "max(u, 0.5) - w"],
      diffusion: [1, 5, 2],
    });
    expect(k.jacobianMethod).toBe("symbolic+numeric");
    const p = resolveParameters(k),
      c = [0.7, 0.3, 1.1],
      n = 3;
    const J = new Float64Array(9),
      r1 = new Float64Array(3),
      r2 = new Float64Array(3);
    k.jacobian(c, p, J);
    for (let j = 0; j < n; j++) {
      const h = 1e-6,
        up = [...c],
        dn = [...c];
      up[j] += h;
      dn[j] -= h;
      k.rates(up, p, r1);
      k.rates(dn, p, r2);
      // central difference error O(h²) (common practice, no source)
      for (let i = 0; i < n; i++) expect(J[i * n + j]).toBeCloseTo((r1[i] - r2[i]) / (2 * h), 6);
    }
    expect(J[6]).toBeCloseTo(1, 6); // ∂max(u, 0.5)/∂u = 1 for u = 0.7 > 0.5
  });

  it("accepts a full cross-diffusion matrix in parameters and 6 species", () => {
    const cross = compileKinetics({
      name: "cross",
      species: ["u", "v"],
      parameters: [{ name: "c", default: 0.3 }],
      reactions: ["1 - u", "u - v"],
      diffusion: [
        [1, "c"],
        ["c/2", 4],
      ],
    });
    expect(cross.diagonalDiffusion).toBe(false);
    const D = new Float64Array(4);
    cross.diffusion(resolveParameters(cross), D);
    expect(Array.from(D)).toEqual([1, 0.3, 0.15, 4]);
    const six = ["a1", "a2", "a3", "a4", "a5", "a6"];
    const k6 = compileKinetics({
      name: "chain",
      species: six,
      parameters: [],
      reactions: six.map((s, i) => `${i + 1} - ${s}`),
      diffusion: [1, 1, 1, 1, 1, 1],
    });
    const r = computeDispersion(k6, {});
    // linear decay chain: c_i* = i (R_i = i − c_i), J = −I → stable
    expect(Object.values(r.steadyState.values).map((v) => Math.round(v * 1e9) / 1e9)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(r.classification.classes).toEqual(["stable"]);
  });
});
