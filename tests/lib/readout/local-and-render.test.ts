import { describe, expect, it } from "vitest";
import { mapLocalWavelength, renderFftMagnitude, renderPreview } from "@/lib/readout";
import { gradientWavelengthAtPx, makeGradientStripes, makeStripes } from "@/lib/synthetic";

describe("local wavelength", () => {
  it("follows a linear wavelength gradient along x (exact local λ of the generator, calculus)", () => {
    const opts = { width: 512, height: 128, wavelengthStartPx: 10, wavelengthEndPx: 20 };
    const map = mapLocalWavelength(makeGradientStripes(opts), { pixelSizeUm: 1, tileSizePx: 96, axis: "x" });
    expect(map.profile.positionUm.length).toBe(map.columns);
    for (let k = 0; k < map.columns; k++) {
      const want = gradientWavelengthAtPx(opts, map.centresXPx[k]);
      expect(Math.abs(map.profile.wavelengthUm[k]! - want) / want).toBeLessThan(0.04); // a tile averages λ over its width
    }
    expect(map.profile.wavelengthUm[map.columns - 1]!).toBeGreaterThan(map.profile.wavelengthUm[0]! * 1.5);
  });
});

describe("rendered images", () => {
  it("the FFT magnitude image is brightest at ±k of the stripes (position of the DFT peak, definition)", () => {
    const img = makeStripes({ width: 128, height: 128, wavelengthPx: 16, angleDeg: 0 });
    const { image: f, ringFraction } = renderFftMagnitude(img, { pixelSizeUm: 1 });
    expect([f.width, f.height]).toEqual([128, 128]);
    expect(ringFraction).toBeNull();
    let best = 0,
      at = 0;
    f.data.forEach((v, i) => {
      if (v > best) {
        best = v;
        at = i;
      }
    });
    const x = at % 128,
      y = Math.floor(at / 128);
    expect(y).toBe(64);
    expect(Math.abs(x - 64)).toBe(8); // 128 px / 16 px = 8 cycles
    // Cropped around a peak of 16 px: ± 3/16 cycles/px = ± 24 bins of 128, the ring at a third of the half-width.
    const crop = renderFftMagnitude(img, { pixelSizeUm: 0.5 }, 16);
    expect([crop.image.width, crop.image.height]).toEqual([48, 48]);
    expect(crop.ringFraction).toBeCloseTo(1 / 3, 12);
    expect(crop.maxFrequencyPerUm).toBeCloseTo(24 / 128 / 0.5, 12);
    let cb = 0,
      cat = 0;
    crop.image.data.forEach((v, i) => {
      if (v > cb) {
        cb = v;
        cat = i;
      }
    });
    expect(Math.floor(cat / 48)).toBe(24);
    expect(Math.abs((cat % 48) - 24)).toBe(8);
    const p = renderPreview(img, { pixelSizeUm: 1, roi: { kind: "rect", x: 0, y: 0, width: 100, height: 50 } });
    expect([p.width, p.height]).toEqual([100, 50]);
    expect(Math.max(...p.data)).toBeLessThanOrEqual(1);
  });
});
