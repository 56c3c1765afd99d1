/**
 * Frames of tissue on a slide, as labs produce them, with the wavelength exact by construction
 * (lib/synthetic/make-tissue-frame.ts): tissue ellipses and half-discs covering 30–70 % of the
 * frame on dark and on bright slides, saturated debris, low-count shot noise, 8-bit saturation of
 * the brightest spots, brightfield contrast, uneven illumination and blur. The default readout
 * must give the wavelength within 2 % with the right symmetry, find the tissue (IoU ≥ 0.9 with the
 * generator's truth), count the treated pixels close to the clipped ones, and say "no significant
 * period" on the same frames without a pattern. (Tolerances: the acceptance figures;
 * the treated-count band is common practice, no source.)
 */
import { describe, expect, it } from "vitest";
import { readWavelength } from "@/lib/readout";
import { makeTissueFrame, type TissueFrameOptions } from "@/lib/synthetic";

const SIZE = { width: 352, height: 288 };

type Case = Omit<TissueFrameOptions, "width" | "height"> & { checkRegion?: boolean };
const patterned: Case[] = [
  {
    pattern: "spots",
    wavelengthPx: 16,
    tissue: { shape: "ellipse", coverage: 0.4, slide: "dark" },
    vignetting: 3,
    noise: 0.2,
    debrisCount: 20,
    seed: 21,
    checkRegion: true,
  },
  {
    pattern: "stripes",
    wavelengthPx: 20,
    angleDeg: 30,
    tissue: { shape: "half-disc", coverage: 0.5, slide: "bright" },
    gradient: 4,
    multiplicative: true,
    noise: 0.1,
    brightfield: true,
    photonsPerUnit: 10,
    seed: 22,
    checkRegion: true,
  },
  {
    pattern: "spots",
    wavelengthPx: 24,
    angleDeg: 5,
    tissue: { shape: "half-disc", coverage: 0.7, slide: "dark" },
    vignetting: 5,
    multiplicative: true,
    noise: 0.2,
    debrisCount: 50,
    blurSigmaPx: 1,
    seed: 23,
    checkRegion: true,
  },
  {
    pattern: "spots",
    wavelengthPx: 18,
    angleDeg: 15,
    brightfield: true,
    tissue: { shape: "ellipse", coverage: 0.6, slide: "bright" },
    photonsPerUnit: 5,
    gradient: 3,
    seed: 24,
    checkRegion: true,
  },
  {
    pattern: "stripes",
    wavelengthPx: 14,
    angleDeg: 100,
    tissue: { shape: "ellipse", coverage: 0.3, slide: "dark", angleDeg: -30 },
    photonsPerUnit: 8,
    blurSigmaPx: 3,
    vignetting: 2,
    seed: 25,
    checkRegion: true,
  },
  {
    pattern: "stripes",
    wavelengthPx: 12,
    angleDeg: 60,
    tissue: { shape: "ellipse", coverage: 0.3, slide: "bright" },
    vignetting: 10,
    noise: 0.2,
    blurSigmaPx: 2,
    seed: 26,
  },
  { pattern: "spots", wavelengthPx: 14, saturatedFraction: 0.03, vignetting: 2, noise: 0.1, seed: 27 },
  { pattern: "stripes", wavelengthPx: 16, angleDeg: 10, debrisCount: 30, vignetting: 3, noise: 0.3, seed: 28 },
  {
    pattern: "spots",
    wavelengthPx: 20,
    angleDeg: 50,
    tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" },
    saturatedFraction: 0.05,
    debrisCount: 10,
    vignetting: 10,
    noise: 0.2,
    seed: 29,
  },
];
const backgroundOnly: Case[] = [
  {
    pattern: "none",
    tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" },
    vignetting: 3,
    noise: 0.2,
    debrisCount: 20,
    seed: 31,
  },
  {
    pattern: "none",
    tissue: { shape: "half-disc", coverage: 0.5, slide: "bright" },
    gradient: 4,
    photonsPerUnit: 10,
    seed: 32,
  },
  { pattern: "none", debrisCount: 40, vignetting: 10, noise: 0.3, blurSigmaPx: 1, seed: 33 },
  { pattern: "none", saturatedFraction: 0.02, vignetting: 3, noise: 0.3, blurSigmaPx: 2, seed: 34 },
  {
    pattern: "none",
    tissue: { shape: "ellipse", coverage: 0.6, slide: "bright" },
    brightfield: true,
    vignetting: 6,
    multiplicative: true,
    photonsPerUnit: 5,
    blurSigmaPx: 1.5,
    seed: 35,
  },
  {
    pattern: "none",
    tissue: { shape: "half-disc", coverage: 0.35, slide: "dark" },
    gradient: 8,
    noise: 0.05,
    blurSigmaPx: 3,
    seed: 36,
  },
];

const describeCase = (c: Case) =>
  [
    c.pattern === "none" ? "no pattern" : `${c.pattern} λ = ${c.wavelengthPx} px`,
    c.tissue ? `${c.tissue.shape} ${Math.round(100 * c.tissue.coverage)} % on a ${c.tissue.slide} slide` : "full frame",
    c.debrisCount ? `${c.debrisCount} debris` : "",
    c.saturatedFraction ? `8-bit, ${100 * c.saturatedFraction} % saturated` : "",
    c.photonsPerUnit ? `${c.photonsPerUnit} photons/unit` : "",
    c.brightfield ? "brightfield" : "",
  ]
    .filter(Boolean)
    .join(", ");

/** Intersection over union of two masks (1 = inside). */
function iou(a: Uint8Array, b: Uint8Array | null): number {
  let inter = 0,
    union = 0;
  for (let i = 0; i < a.length; i++) {
    const bi = b ? b[i] : 1;
    inter += a[i] & bi;
    union += a[i] | bi;
  }
  return inter / union;
}

describe("tissue frames: the default readout", () => {
  it.each(patterned.map((c) => [describeCase(c), c] as const))("%s: λ within 2 %, right symmetry", (_, c) => {
    const frame = makeTissueFrame({ ...SIZE, ...c });
    const r = readWavelength(frame.image, { pixelSizeUm: 1 });
    expect(r.periodFound).toBe(true);
    expect(Math.abs(r.wavelengthPx! / c.wavelengthPx! - 1)).toBeLessThan(0.02);
    expect(r.symmetry).toBe(c.pattern === "spots" ? "hexagonal" : "stripes");
    if (c.checkRegion) {
      expect(r.tissueRegion.found).toBe(true);
      expect(r.tissueRegion.outline!.length).toBeGreaterThanOrEqual(3);
    }
    if (frame.saturatedPixels > 0) {
      // Clipped pixels and debris are treated, plus a one-pixel rim and blurred debris halos: 0.6× to 2.5×.
      expect(r.treatedPixels.total).toBeGreaterThanOrEqual(0.6 * frame.outlierPixels);
      expect(r.treatedPixels.total).toBeLessThanOrEqual(2.5 * frame.outlierPixels);
      expect(r.warnings.some((w) => /replaced by the surrounding intensity/.test(w))).toBe(true);
    }
  });

  it.each(patterned.filter((c) => c.checkRegion).map((c) => [describeCase(c), c] as const))(
    "%s: the tissue region matches the truth (IoU ≥ 0.9)",
    async (_, c) => {
      const { prepareRegion } = await import("@/lib/readout/prepare-region");
      const { resolveReadoutOptions } = await import("@/lib/readout/options");
      const frame = makeTissueFrame({ ...SIZE, ...c });
      const region = prepareRegion(frame.image, resolveReadoutOptions({ pixelSizeUm: 1 }, SIZE.width, SIZE.height));
      expect(region.tissueMask).not.toBeNull();
      expect(iou(frame.tissueMask, region.tissueMask)).toBeGreaterThanOrEqual(0.9);
    },
  );

  it.each(backgroundOnly.map((c) => [describeCase(c), c] as const))("%s: no significant period", (_, c) => {
    const r = readWavelength(makeTissueFrame({ ...SIZE, ...c }).image, { pixelSizeUm: 1 });
    expect(r.periodFound).toBe(false);
    expect(r.wavelengthUm).toBeNull();
    expect(r.significance).toBeLessThan(r.significanceThreshold);
  });

  it("a full-frame pattern without slide gets no mask, and tissueMask: off turns the search off", () => {
    const c: Case = { pattern: "stripes", wavelengthPx: 16, vignetting: 3, noise: 0.2, seed: 41 };
    expect(readWavelength(makeTissueFrame({ ...SIZE, ...c }).image, { pixelSizeUm: 1 }).tissueRegion).toEqual({
      found: false,
      fraction: 1,
      outline: null,
    });
    const t = makeTissueFrame({ ...SIZE, ...patterned[0] });
    const off = readWavelength(t.image, { pixelSizeUm: 1, tissueMask: "off" });
    expect(off.tissueRegion.found).toBe(false);
    expect(off.settings.tissueMask).toBe("off");
  });
});
