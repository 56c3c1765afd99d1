/**
 * A field whose wavelength drifts gets a warning with the range, not one silent number. Stripes whose
 * local wavelength grows linearly from 19 to 29 px (lib/synthetic/make-gradient-stripes.ts: exact by
 * construction, calculus); uniform stripes get no warning.
 */
import { describe, expect, it } from "vitest";
import { readWavelength } from "@/lib/readout";
import { measureWavelengthDrift } from "@/lib/readout/wavelength-drift";
import { makeGradientStripes, makeStripes } from "@/lib/synthetic";

describe("the wavelength changes across the field", () => {
  it("19 → 29 px across 512 px: flagged, with a range inside the truth", () => {
    const img = makeGradientStripes({
      width: 512,
      height: 384,
      wavelengthStartPx: 19,
      wavelengthEndPx: 29,
      noise: 0.1,
    });
    const r = readWavelength(img, { pixelSizeUm: 1 });
    expect(r.wavelengthDrift!.flagged).toBe(true);
    const lo = Math.min(r.wavelengthDrift!.fromUm, r.wavelengthDrift!.toUm);
    const hi = Math.max(r.wavelengthDrift!.fromUm, r.wavelengthDrift!.toUm);
    // The plane through sub-region centres spans most of the true 19–29 range (±1.5 px: common practice, no source).
    expect(lo).toBeGreaterThan(17.5);
    expect(hi).toBeLessThan(30.5);
    expect(hi - lo).toBeGreaterThan(5);
    expect(r.warnings.some((w) => /changes across the field from/.test(w))).toBe(true);
  });

  it("uniform stripes: no drift warning", () => {
    const r = readWavelength(makeStripes({ width: 512, height: 384, wavelengthPx: 23, angleDeg: 30, noise: 0.3 }), {
      pixelSizeUm: 1,
    });
    expect(r.wavelengthDrift!.flagged).toBe(false);
    expect(r.warnings.some((w) => /changes across the field/.test(w))).toBe(false);
  });

  it("scatter without a trend is not a drift (3 standard errors of the rise)", () => {
    const samples = [0, 1, 2].flatMap((i) =>
      [0, 1, 2].map((j) => ({ xPx: 100 * i, yPx: 100 * j, wavelengthPx: 20 + (((i * 3 + j) * 7) % 5) - 2 })),
    );
    expect(measureWavelengthDrift(samples, 300, 300)!.flagged).toBe(false);
  });
});
