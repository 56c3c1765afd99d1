/**
 * The grid-free 2×2 map cell against the general dispersion engine (eigenvalues of J − k²D on a k
 * grid, refined): the same class and, where a k > 0 mode grows, the same k* — over thousands of
 * random Jacobians and diffusivities, and on the textbook Turing conditions (Murray 2003,
 * Mathematical Biology II, §2.3, eqs. 2.27–2.30).
 */
import seedrandom from "seedrandom";
import { describe, expect, it } from "vitest";
import { compileKinetics } from "@/lib/kinetics";
import { classOf, computeDispersion } from "@/lib/stability";
import { analyseCell2x2, sigmaMax2x2 } from "@/lib/stability/cell-2x2";

/** Linear kinetics with Jacobian J around u = v = 0 and diffusivities Du, Dv (parameters). */
const linear = compileKinetics({
  name: "linear",
  species: ["u", "v"],
  parameters: ["a", "b", "c", "d", "Du", "Dv"].map((name) => ({ name, default: 1, min: -1e6, max: 1e6 })),
  reactions: ["a * u + b * v", "c * u + d * v"],
  diffusion: ["Du", "Dv"],
});

describe("grid-free 2×2 map cell", () => {
  it("agrees with computeDispersion on 3000 random cells: class, and k* where a mode grows", () => {
    const rng = seedrandom("cell-2x2");
    const r = (lo: number, hi: number) => lo + (hi - lo) * rng();
    let peaks = 0,
      compared = 0;
    for (let i = 0; i < 3000; i++) {
      const J = [r(-2, 2), r(-3, 3), r(-3, 3), r(-2, 2)];
      const Du = Math.exp(r(-2, 1)),
        Dv = Math.exp(r(-1, 4));
      const peak = { k: NaN, sigma: -Infinity };
      const flags = analyseCell2x2(J, Du, Dv, peak);
      const d = computeDispersion(linear, { a: J[0], b: J[1], c: J[2], d: J[3], Du, Dv });
      // Within rounding of a threshold either answer is right: skip cells whose growth is marginal.
      if (d.classification.marginal || (peak.k > 0 && peak.sigma < 1e-6)) continue;
      compared++;
      expect(classOf(flags), `J = ${J}, D = ${Du}, ${Dv}`).toBe(classOf(d.classification.flags));
      if (peak.k > 0) {
        peaks++;
        expect(Math.abs(peak.k / d.fastest!.kStar - 1)).toBeLessThan(1e-6);
        expect(Math.abs(peak.sigma / d.fastest!.sigmaStar - 1)).toBeLessThan(1e-9);
      }
    }
    expect(compared).toBeGreaterThan(2900);
    expect(peaks).toBeGreaterThan(200);
  });

  it("finds a band far narrower than any wavenumber grid, just past the Turing threshold", () => {
    // Schnakenberg's Jacobian at a = 0.1, b = 0.9 (Murray 2003 §2.4): fu = 2/3, fv = 1, gu = −1.8, gv = −1,
    // critical ratio d_c ≈ 8.57 — at d = d_c(1 + 1e-6) the band is ~1e-3 of k_c wide.
    const J = [2 / 3, 1, -1.8, -1];
    const [fu, fv, gu, gv] = J;
    // d_c: root of fu² d² + 2(2 fv gu − fu gv) d + gv² = 0 with d fu + gv > 0 (Murray 2003 eq. 2.32).
    const qa = fu * fu,
      qb = 2 * (2 * fv * gu - fu * gv),
      qc = gv * gv;
    const dc = (-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa);
    const peak = { k: NaN, sigma: -Infinity };
    expect(classOf(analyseCell2x2(J, 1, dc * (1 + 1e-6), peak))).toBe("turing");
    const kc = Math.sqrt((dc * fu + gv) / (2 * dc)); // k_c² = (Dv fu + Du gv)/(2 Du Dv), §2.3
    expect(Math.abs(peak.k / kc - 1)).toBeLessThan(1e-3);
    expect(peak.sigma).toBeGreaterThan(0);
    expect(classOf(analyseCell2x2(J, 1, dc * (1 - 1e-6), { k: NaN, sigma: -Infinity }))).toBe("stable");
  });

  it("σ_max is the larger real part of the eigenvalues of J − qD (closed form of a 2×2 matrix)", () => {
    // J − qD = [[1 − 2q, 2], [−3, −1 − q]] at q = 0.5: trace −1.5, det 0 + 6 = 6, complex pair, Re = −0.75.
    expect(sigmaMax2x2(1, 2, -3, -1, 2, 1, 0.5)).toBeCloseTo(-0.75, 14);
    // [[2, 1], [1, 2]]: eigenvalues 1 and 3.
    expect(sigmaMax2x2(2, 1, 1, 2, 1, 1, 0)).toBeCloseTo(3, 14);
  });
});
