import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import seedrandom from "seedrandom";
import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion, eigenvalues, leadingEigenvalue } from "@/lib/stability";
import { createScanWorkspace, sigmaAt } from "@/lib/stability/dispersion-scan";

/** Leading eigenvalue by ml-matrix's general (Hessenberg QR) solver — the reference library. */
function reference(m: number[], n: number): [number, number] {
  const rows = Array.from({ length: n }, (_, i) => m.slice(i * n, i * n + n));
  const e = new EigenvalueDecomposition(new Matrix(rows));
  let best = 0;
  e.realEigenvalues.forEach((re, i) => {
    if (re > e.realEigenvalues[best]) best = i;
  });
  return [e.realEigenvalues[best], Math.abs(e.imaginaryEigenvalues[best])];
}

describe("2×2 closed form vs the general eigen solver", () => {
  it("agrees to rounding on 500 random matrices (real and complex pairs)", () => {
    const rng = seedrandom("eigen-2x2");
    const out = new Float64Array(2);
    let complex = 0;
    for (let t = 0; t < 500; t++) {
      const m = Array.from({ length: 4 }, () => 10 * (rng() - 0.5));
      leadingEigenvalue(m, 2, out);
      const [re, im] = reference(m, 2);
      if (im > 0) complex++;
      expect(out[0]).toBeCloseTo(re, 10);
      expect(out[1]).toBeCloseTo(im, 10);
    }
    expect(complex).toBeGreaterThan(50);
  });

  it("σ_max(k) of a catalogue model agrees with ml-matrix on J − k²D at every grid point", () => {
    const r = computeDispersion(getCatalogueKinetics("lengyel-epstein"), {});
    const J = r.jacobian.flat(),
      D = r.diffusion.flat();
    r.curve.k.forEach((k, i) => {
      const [re, im] = reference(
        J.map((x, j) => x - k * k * D[j]),
        2,
      );
      expect(r.curve.sigma[i]).toBeCloseTo(re, 10);
      expect(r.curve.imSigma[i]).toBeCloseTo(im, 10);
    });
  });

  it("the n-species path (n = 3) equals the reference on random matrices", () => {
    const rng = seedrandom("eigen-3x3");
    const ws = createScanWorkspace(3, 16);
    for (let t = 0; t < 50; t++) {
      for (let i = 0; i < 9; i++) {
        ws.J[i] = 4 * (rng() - 0.5);
        ws.D[i] = i % 4 === 0 ? 0.1 + rng() : 0;
      }
      const k = 3 * rng();
      const s = sigmaAt(ws, k);
      const [re, im] = reference(
        Array.from(ws.J, (x, j) => x - k * k * ws.D[j]),
        3,
      );
      expect(s).toBeCloseTo(re, 10);
      expect(ws.eig[1]).toBeCloseTo(im, 10);
    }
    expect(eigenvalues([2, 0, 0, 0, -1, 0, 0, 0, 3], 3).re).toEqual([3, 2, -1]);
  });
});
