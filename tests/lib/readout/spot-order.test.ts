/**
 * Spots found in real space and their bond-orientational order ψ₆ (lib/readout/spot-order.ts).
 * ψ₆ = 1 on a perfect triangular lattice and → 0 for points without orientational order
 * (Nelson & Halperin 1979, Phys. Rev. B 19:2457; Strandburg 1988, Rev. Mod. Phys. 60:161).
 */
import { describe, expect, it } from "vitest";
import { measureBondOrder, measureSpotOrder } from "@/lib/readout/spot-order";
import { createRng } from "@/lib/synthetic/random";
import { makeHexSpots, makeLabyrinth, makeStripes } from "@/lib/synthetic";

function latticePoints(a: number, angleRad: number, width: number, height: number) {
  const xs: number[] = [],
    ys: number[] = [];
  for (let j = -60; j <= 60; j++)
    for (let i = -60; i <= 60; i++) {
      const u = i * a + (j * a) / 2,
        v = (j * a * Math.sqrt(3)) / 2;
      const x = width / 2 + u * Math.cos(angleRad) - v * Math.sin(angleRad);
      const y = height / 2 + u * Math.sin(angleRad) + v * Math.cos(angleRad);
      if (x >= 0 && y >= 0 && x < width && y < height) {
        xs.push(x);
        ys.push(y);
      }
    }
  return { xs: Float64Array.from(xs), ys: Float64Array.from(ys) };
}

describe("bond-orientational order ψ₆", () => {
  it("is 1 on a perfect triangular lattice, at any orientation (Nelson & Halperin 1979)", () => {
    for (const angle of [0, 0.3, 1]) {
      const { xs, ys } = latticePoints(10, angle, 400, 300);
      const o = measureBondOrder(xs, ys, 400, 300, 15);
      expect(o.psi6Local).toBeCloseTo(1, 6);
      expect(o.psi6Global).toBeCloseTo(1, 6);
    }
  });

  it("vanishes like 1/√n for uniformly random points (no orientational order; Strandburg 1988)", () => {
    const rng = createRng(7);
    const n = 4000;
    const xs = Float64Array.from({ length: n }, () => rng.uniform() * 1000);
    const ys = Float64Array.from({ length: n }, () => rng.uniform() * 1000);
    const o = measureBondOrder(xs, ys, 1000, 1000, 30);
    const interior = o.interior.reduce((s, v) => s + v, 0);
    // n unit phasors of random phase sum to ~√n: 3/√n bounds the global mean with margin (common practice, no source).
    expect(o.psi6Global).toBeLessThan(3 / Math.sqrt(interior));
    // Local |ψ₆| of a Poisson pattern stays well below a crystal's; 0.2–0.6 (from memory).
    expect(o.psi6Local).toBeGreaterThan(0.2);
    expect(o.psi6Local).toBeLessThan(0.6);
  });
});

describe("spots found in the image", () => {
  const a = 18; // nearest-neighbour spacing; Fourier wavelength λ = (√3/2)·a (SCIENCE.md §4)
  const lambda = (Math.sqrt(3) / 2) * a;

  it("a perfect lattice of bright spots: ψ₆ ≈ 1, round spots, NN = a", () => {
    const img = makeHexSpots({ width: 320, height: 320, spacingPx: a, angleDeg: 7, noise: 0.05, seed: 3 });
    const o = measureSpotOrder(img.data, 320, 320, lambda)!;
    expect(o.polarity).toBe("bright");
    expect(o.psi6Local).toBeGreaterThan(0.95);
    expect(o.roundness).toBeGreaterThan(0.8);
    // NN within 1 % of the construction's spacing (common practice, no source).
    expect(Math.abs(o.nearestNeighbourMeanPx / a - 1)).toBeLessThan(0.01);
  });

  it("dark spots on a light field (brightfield) are found as minima", () => {
    const img = makeHexSpots({ width: 320, height: 320, spacingPx: a, angleDeg: 20, noise: 0.05, seed: 4 });
    const inverted = img.data.map((v) => 1 - v);
    const o = measureSpotOrder(inverted, 320, 320, lambda)!;
    expect(o.polarity).toBe("dark");
    expect(o.psi6Local).toBeGreaterThan(0.95);
    expect(Math.abs(o.nearestNeighbourMeanPx / a - 1)).toBeLessThan(0.01);
  });

  it("a disordered packing (each spot moved by 5 % of a) keeps a high local ψ₆", () => {
    const img = makeHexSpots({ width: 320, height: 320, spacingPx: a, jitterPx: 0.05 * a, noise: 0.05, seed: 5 });
    const o = measureSpotOrder(img.data, 320, 320, lambda)!;
    expect(o.psi6Local).toBeGreaterThan(0.8);
  });

  it("points on stripes and labyrinth ridges are not round (Hessian ratio; Lindeberg 1998)", () => {
    const stripes = makeStripes({ width: 320, height: 320, wavelengthPx: 16, angleDeg: 20, noise: 0.05 });
    const labyrinth = makeLabyrinth({ width: 320, height: 320, wavelengthPx: 16, seed: 2 });
    for (const img of [stripes, labyrinth]) {
      const o = measureSpotOrder(img.data, 320, 320, 16);
      expect(o).not.toBeNull();
      expect(o!.roundness).toBeLessThan(0.5);
    }
  });
});
