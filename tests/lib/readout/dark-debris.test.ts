/**
 * Dark debris (opaque particles in brightfield) is treated like bright debris: found on the
 * flattened image below a robust lower limit, replaced by its surroundings, counted and named in
 * the readout's notes; it neither moves the peak nor makes a period where there is none. A frame
 * and its negative read the same. Frames from lib/synthetic/make-tissue-frame.ts with the
 * wavelength exact by construction. (Tolerances: the real-frames issue's acceptance figures,
 * 2 % on λ; the 0.6×–2.5× band for treated pixels is the one the bright-debris tests use —
 * common practice, no source.)
 */
import { describe, expect, it } from "vitest";
import { readWavelength } from "@/lib/readout";
import { makeTissueFrame, type TissueFrameOptions } from "@/lib/synthetic";

const SIZE = { width: 384, height: 320 };
type Case = Omit<TissueFrameOptions, "width" | "height">;

const patterned: Case[] = [
  {
    pattern: "stripes",
    wavelengthPx: 16,
    angleDeg: 70,
    brightfield: true,
    debrisCount: 40,
    debrisContrast: "dark",
    vignetting: 5,
    noise: 0.2,
    seed: 42,
  },
  {
    pattern: "spots",
    wavelengthPx: 14,
    brightfield: true,
    debrisCount: 50,
    debrisContrast: "dark",
    noise: 0.2,
    seed: 44,
  },
  {
    pattern: "spots",
    wavelengthPx: 24,
    angleDeg: 35,
    brightfield: true,
    debrisCount: 30,
    debrisContrast: "dark",
    vignetting: 3,
    multiplicative: true,
    noise: 0.1,
    seed: 45,
  },
];

describe("dark debris", () => {
  it.each(patterned.map((c) => [`${c.pattern} λ = ${c.wavelengthPx} px, ${c.debrisCount} dark particles`, c] as const))(
    "%s: λ within 2 %, right symmetry, the debris treated and named",
    (_, c) => {
      const frame = makeTissueFrame({ ...SIZE, ...c });
      const r = readWavelength(frame.image, { pixelSizeUm: 1 });
      expect(r.periodFound).toBe(true);
      expect(Math.abs(r.wavelengthPx! / c.wavelengthPx! - 1)).toBeLessThan(0.02);
      expect(r.symmetry).toBe(c.pattern === "spots" ? "hexagonal" : "stripes");
      expect(r.treatedPixels.dark).toBeGreaterThanOrEqual(0.6 * frame.debrisPixels);
      expect(r.treatedPixels.dark).toBeLessThanOrEqual(2.5 * frame.debrisPixels);
      expect(r.treatedPixels.total).toBe(r.treatedPixels.saturated + r.treatedPixels.bright + r.treatedPixels.dark);
      expect(r.warnings.some((w) => /pixels of dark debris \(with their rim\)/.test(w))).toBe(true);
    },
  );

  it("a frame with only dark debris on tissue and slide has no significant period", () => {
    const frame = makeTissueFrame({
      ...SIZE,
      pattern: "none",
      tissue: { shape: "half-disc", coverage: 0.5, slide: "bright" },
      brightfield: true,
      debrisCount: 40,
      debrisContrast: "dark",
      vignetting: 3,
      noise: 0.2,
      blurSigmaPx: 1,
      seed: 43,
    });
    const r = readWavelength(frame.image, { pixelSizeUm: 1 });
    expect(r.periodFound).toBe(false);
    expect(r.significance).toBeLessThan(r.significanceThreshold);
  });

  it("a frame and its negative: the same wavelength, and bright debris in one is dark debris in the other", () => {
    const frame = makeTissueFrame({
      ...SIZE,
      pattern: "stripes",
      wavelengthPx: 18,
      angleDeg: 15,
      debrisCount: 30,
      debrisContrast: "dark",
      brightfield: true,
      vignetting: 3,
      noise: 0.2,
      seed: 46,
    });
    const negative = { ...frame.image, data: frame.image.data.map((v) => -v) };
    const a = readWavelength(frame.image, { pixelSizeUm: 1 });
    const b = readWavelength(negative, { pixelSizeUm: 1 });
    expect(b.wavelengthPx!).toBeCloseTo(a.wavelengthPx!, 6);
    expect(a.treatedPixels.dark).toBeGreaterThan(0);
    expect(a.treatedPixels.bright).toBe(0);
    // The limits come from sampled quantiles, which mirror to within a sample: counts within 5 %.
    expect(Math.abs(b.treatedPixels.bright - a.treatedPixels.dark)).toBeLessThanOrEqual(0.05 * a.treatedPixels.dark);
  });

  it("an unknown debris contrast is refused, naming the option", () => {
    expect(() =>
      makeTissueFrame({
        ...SIZE,
        pattern: "stripes",
        wavelengthPx: 16,
        debrisCount: 3,
        debrisContrast: "grey" as "dark",
      }),
    ).toThrow(/debrisContrast must be "bright" or "dark" \(got grey\)/);
  });
});
