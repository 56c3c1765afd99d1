import { describe, expect, it } from "vitest";
import { readWavelength } from "@/lib/readout";
import { makeHexSpots, makeLabyrinth, makeNoise, makeStripes } from "@/lib/synthetic";

/** Angle difference modulo a period (degrees). */
const angDiff = (a: number, b: number, period: number) => {
  const d = (((a - b) % period) + period) % period;
  return Math.min(d, period - d);
};

describe("stripes: wavelength and orientation recovered (plane-wave geometry; target 1 % from the brief)", () => {
  it.each([
    // [width, height, λ px, angle°] — non-square and non-power-of-two sizes on purpose
    [256, 256, 16, 0],
    [300, 220, 12.5, 30],
    [200, 333, 20, 73],
    [257, 129, 9, 135],
    [128, 512, 11, 90],
  ])("%i×%i, λ = %f px at %f°", (width, height, wavelengthPx, angleDeg) => {
    const r = readWavelength(makeStripes({ width, height, wavelengthPx, angleDeg, noise: 0.1, seed: width }), {
      pixelSizeUm: 0.5,
    });
    expect(r.periodFound).toBe(true);
    expect(r.wavelengthPx).toBeWithinRelative(wavelengthPx, 0.01);
    expect(r.wavelengthUm).toBeWithinRelative(wavelengthPx * 0.5, 0.01); // µm = px × µm/px
    expect(r.symmetry).toBe("stripes");
    expect(angDiff(r.orientationDeg!, angleDeg, 180)).toBeLessThan(1);
    expect(r.anisotropy).toBeGreaterThan(0.9); // one direction → mean resultant length ≈ 1
    expect(r.autocorrelation?.agrees).toBe(true);
  });

  it("the same wavelength for both contrasts (|F|² is unchanged by negation: F(−x) = −F(x))", () => {
    const img = makeStripes({ width: 200, height: 180, wavelengthPx: 14, angleDeg: 20, noise: 0.05 });
    const a = readWavelength(img, { pixelSizeUm: 1 });
    const b = readWavelength({ ...img, data: img.data.map((v) => 1 - v) }, { pixelSizeUm: 1 });
    const c = readWavelength(img, { pixelSizeUm: 1, invert: true });
    expect(b.wavelengthPx).toBeCloseTo(a.wavelengthPx!, 6);
    expect(c.wavelengthPx).toBeCloseTo(a.wavelengthPx!, 6);
  });

  it("the reported uncertainty covers the error over several noisy seeds (|error| ≤ 3u in ≥ 4 of 5; common practice, no source)", () => {
    let covered = 0;
    for (let seed = 1; seed <= 5; seed++) {
      const r = readWavelength(
        makeStripes({ width: 256, height: 256, wavelengthPx: 13.7, angleDeg: 17 * seed, noise: 0.3, seed }),
        { pixelSizeUm: 1 },
      );
      // The combined uncertainty (GUM) includes the sub-region spread when the field allows it.
      expect(r.uncertaintyMethod).toBe("combined");
      expect(r.uncertaintyComponentsUm!.subregion).toBeGreaterThan(0);
      if (Math.abs(r.wavelengthPx! - 13.7) <= 3 * r.uncertaintyPx!) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(4);
  });
});

describe("hexagonal spots: λ = (√3/2)·a and a reported (SCIENCE.md §4, lattice geometry)", () => {
  it.each([
    [256, 256, 20, 10],
    [300, 240, 14, 0],
    [240, 300, 25, 45],
  ])("%i×%i, a = %f px at %f°", (width, height, spacingPx, angleDeg) => {
    const r = readWavelength(
      makeHexSpots({ width, height, spacingPx, angleDeg, jitterPx: 0.5, noise: 0.05, seed: 2 }),
      { pixelSizeUm: 1 },
    );
    expect(r.symmetry).toBe("hexagonal");
    expect(r.wavelengthPx).toBeWithinRelative((Math.sqrt(3) / 2) * spacingPx, 0.01);
    expect(r.nearestNeighbourUm).toBeWithinRelative(spacingPx, 0.01);
    // reciprocal vectors sit 30° from the lattice vectors (geometry); reported mod 60°
    expect(angDiff(r.orientationDeg!, angleDeg + 30, 60)).toBeLessThan(1.5);
    expect(r.symmetryScores.h6).toBeGreaterThan(0.4);
  });
});

describe("labyrinth and noise", () => {
  it("labyrinth: ring peak at 1/λ, isotropic, called labyrinth (ring spectrum by construction)", () => {
    const r = readWavelength(makeLabyrinth({ width: 256, height: 256, wavelengthPx: 14, seed: 5 }), { pixelSizeUm: 1 });
    expect(r.symmetry).toBe("labyrinth");
    expect(r.wavelengthPx).toBeWithinRelative(14, 0.02);
    expect(r.anisotropy).toBeLessThan(0.4);
  });
  it.each([
    [64, 64, 1],
    [128, 96, 2],
    [256, 256, 3],
    [200, 150, 4],
  ])(
    "white noise %i×%i → no significant period (flat spectrum; ratios near 1–2, SCIENCE.md §5.7)",
    (width, height, seed) => {
      const r = readWavelength(makeNoise({ width, height, seed }), { pixelSizeUm: 1 });
      expect(r.periodFound).toBe(false);
      expect(r.wavelengthUm).toBeNull();
      expect(r.significance).toBeLessThan(r.significanceThreshold);
    },
  );
});

describe("ROI and mask", () => {
  it("a rectangle ROI reads the pattern inside it only (two-pattern image)", () => {
    const left = makeStripes({ width: 128, height: 128, wavelengthPx: 8, angleDeg: 0 });
    const right = makeStripes({ width: 128, height: 128, wavelengthPx: 16, angleDeg: 90 });
    const data = new Float32Array(256 * 128);
    for (let y = 0; y < 128; y++) {
      data.set(left.data.subarray(y * 128, (y + 1) * 128), y * 256);
      data.set(right.data.subarray(y * 128, (y + 1) * 128), y * 256 + 128);
    }
    const img = { width: 256, height: 128, data };
    const r = readWavelength(img, { pixelSizeUm: 1, roi: { kind: "rect", x: 128, y: 0, width: 128, height: 128 } });
    expect(r.wavelengthPx).toBeWithinRelative(16, 0.01);
    const p = readWavelength(img, {
      pixelSizeUm: 1,
      roi: {
        kind: "polygon",
        points: [
          [0, 0],
          [120, 0],
          [120, 128],
          [0, 128],
        ],
      },
    });
    expect(p.wavelengthPx).toBeWithinRelative(8, 0.01);
  });
});
