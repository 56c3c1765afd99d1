import { describe, expect, it } from "vitest";
import {
  makeGradientStripes,
  makeHexSpots,
  makeLabyrinth,
  makeNoise,
  makeStripes,
  gradientWavelengthAtPx,
} from "@/lib/synthetic";

describe("makeStripes", () => {
  it("is periodic with the given wavelength along the wave vector (definition of a plane wave)", () => {
    const img = makeStripes({ width: 64, height: 32, wavelengthPx: 8, angleDeg: 0 });
    for (let x = 0; x < 56; x++) expect(img.data[5 * 64 + x]).toBeCloseTo(img.data[5 * 64 + x + 8], 5);
    // cos(0) = 1 → value 1 at x = 0; cos(π) = −1 → value 0 half a wavelength later (trigonometry)
    expect(img.data[0]).toBeCloseTo(1, 6);
    expect(img.data[4]).toBeCloseTo(0, 6);
  });
  it("is constant along the stripes at 45° (x + y constant lines, geometry)", () => {
    const img = makeStripes({ width: 32, height: 32, wavelengthPx: 10, angleDeg: 45 });
    expect(img.data[3 * 32 + 7]).toBeCloseTo(img.data[7 * 32 + 3], 5);
  });
  it("is reproducible for a seed and differs between seeds (seedrandom determinism)", () => {
    const a = makeStripes({ width: 16, height: 16, wavelengthPx: 4, angleDeg: 10, noise: 0.1, seed: 3 });
    const b = makeStripes({ width: 16, height: 16, wavelengthPx: 4, angleDeg: 10, noise: 0.1, seed: 3 });
    const c = makeStripes({ width: 16, height: 16, wavelengthPx: 4, angleDeg: 10, noise: 0.1, seed: 4 });
    expect(Array.from(a.data)).toEqual(Array.from(b.data));
    expect(Array.from(a.data)).not.toEqual(Array.from(c.data));
  });
});

describe("makeHexSpots", () => {
  it("puts a spot of peak 1 at the image centre and at its lattice neighbours a away (hexagonal lattice geometry)", () => {
    const img = makeHexSpots({ width: 100, height: 100, spacingPx: 20, angleDeg: 0 });
    const at = (x: number, y: number) => img.data[y * 100 + x];
    expect(at(50, 50)).toBeCloseTo(1, 5); // centre (W/2, H/2) = (50, 50)
    // neighbour at 60°: (a cos60, a sin60) = (10, 17.32) from the centre
    expect(at(60, 67)).toBeGreaterThan(0.95);
    // midpoint between two neighbours is dark: 10 px from each, HWHM 5 px → exp(-ln2·4) = 1/16
    expect(at(60, 50)).toBeLessThan(0.15);
  });
});

describe("makeGradientStripes", () => {
  it("has local period λ(x): successive maxima are λ(x_mid) apart (calculus, to first order)", () => {
    const opts = { width: 400, height: 2, wavelengthStartPx: 10, wavelengthEndPx: 30 };
    const img = makeGradientStripes(opts);
    const maxima: number[] = [];
    for (let x = 1; x < 399; x++) if (img.data[x] > img.data[x - 1] && img.data[x] >= img.data[x + 1]) maxima.push(x);
    for (let i = 1; i < maxima.length; i++) {
      const mid = (maxima[i] + maxima[i - 1]) / 2;
      expect(Math.abs(maxima[i] - maxima[i - 1] - gradientWavelengthAtPx(opts, mid))).toBeLessThan(1.5); // ±1 px sampling
    }
  });
});

describe("makeNoise and makeLabyrinth", () => {
  it("noise is uniform on [0,1): mean ≈ 1/2, variance ≈ 1/12 (uniform distribution moments)", () => {
    const { data } = makeNoise({ width: 128, height: 128, seed: 9 });
    let s = 0,
      s2 = 0;
    for (const v of data) {
      s += v;
      s2 += v * v;
    }
    const m = s / data.length;
    expect(m).toBeCloseTo(0.5, 2);
    expect(s2 / data.length - m * m).toBeCloseTo(1 / 12, 2);
  });
  it("labyrinth values stay in 0..1 and use both halves of the range (tanh bands)", () => {
    const { data } = makeLabyrinth({ width: 64, height: 64, wavelengthPx: 12, seed: 2 });
    let lo = 0,
      hi = 0;
    for (const v of data) {
      expect(v).toBeGreaterThanOrEqual(0);
      expect(v).toBeLessThanOrEqual(1);
      if (v < 0.2) lo++;
      if (v > 0.8) hi++;
    }
    expect(lo).toBeGreaterThan(400);
    expect(hi).toBeGreaterThan(400);
  });
});
