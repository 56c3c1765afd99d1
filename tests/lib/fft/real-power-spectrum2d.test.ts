import { describe, expect, it } from "vitest";
import { halfPowerSpectrum, realFft2d, realPowerSpectrum2d } from "@/lib/fft";
import type { GreyImage } from "@/lib/imaging";
import { analyseSpectrum } from "@/lib/readout/analyse-spectrum";
import { computePowerSpectrum } from "@/lib/readout/power-spectrum";
import { prepareRegion } from "@/lib/readout/prepare-region";
import { resolveReadoutOptions } from "@/lib/readout/options";
import { applyWindow, makeWindow1d } from "@/lib/readout/window";
import { createRng, makeHexSpots, makeLabyrinth, makeStripes } from "@/lib/synthetic";

describe("realPowerSpectrum2d", () => {
  it("in float64 gives the same bits as window → realFft2d → halfPowerSpectrum (same operations, fused)", () => {
    const rng = createRng(7);
    const w = 300,
      h = 201; // odd height and both sides padded: the unpaired last row and the zero padding
    const img = Float32Array.from({ length: w * h }, () => rng.normal());
    const windowed = img.slice();
    applyWindow(windowed, w, h, "tukey", 0.3);
    const before = halfPowerSpectrum(realFft2d(windowed, w, h, 512, 256));
    const fused = realPowerSpectrum2d(img, w, h, 512, 256, {
      windowX: makeWindow1d("tukey", w, 0.3),
      windowY: makeWindow1d("tukey", h, 0.3),
      precision: "float64",
    });
    expect(fused.halfWidth).toBe(257);
    expect(fused.power.length).toBe(before.length);
    let differing = 0;
    for (let i = 0; i < before.length; i++) if (!Object.is(fused.power[i], before[i])) differing++;
    expect(differing).toBe(0);
  });
});

/** The readout's frequency from the spectrum of one precision (the pipeline of readWavelength up to the peak). */
function peakFrequency(image: GreyImage, precision: "float32" | "float64"): number {
  const settings = resolveReadoutOptions({ pixelSizeUm: 1 }, image.width, image.height);
  const region = prepareRegion(image, settings);
  const spec = computePowerSpectrum(region.data, region.width, region.height, { ...settings, precision });
  return analyseSpectrum(spec, settings.lowCutCycles).frequencyPerPx;
}

describe("float32 half spectrum between the row and column transforms", () => {
  // 1e-6 relative: the precision goal of the readout's speed work (common practice, no source).
  it.each<[string, GreyImage]>([
    ["stripes", makeStripes({ width: 384, height: 256, wavelengthPx: 17.3, angleDeg: 23, noise: 0.2, seed: 1 })],
    ["hexagonal spots", makeHexSpots({ width: 320, height: 320, spacingPx: 21, angleDeg: 7, noise: 0.1, seed: 2 })],
    ["labyrinth", makeLabyrinth({ width: 256, height: 300, wavelengthPx: 24, noise: 0.1, seed: 3 })],
  ])("gives the same peak frequency as float64 to 1e-6 relative: %s", (_, image) => {
    const f64 = peakFrequency(image, "float64");
    const f32 = peakFrequency(image, "float32");
    expect(Math.abs(f32 - f64) / f64).toBeLessThan(1e-6);
  });
});

describe("realPowerSpectrum2d reusing its working memory", () => {
  it("gives the same |F|² for a short image after a taller one of the same padded size (zero padding read as zeros)", () => {
    const rng = createRng(9);
    const tall = Float32Array.from({ length: 64 * 60 }, () => rng.normal());
    const short = Float32Array.from({ length: 64 * 33 }, () => rng.normal());
    // The reference: the short image padded by hand to its full 64 × 64 transform.
    const padded = new Float32Array(64 * 64);
    padded.set(short);
    const expected = realPowerSpectrum2d(padded, 64, 64, 64, 64).power;
    realPowerSpectrum2d(tall, 64, 60, 64, 64);
    const got = realPowerSpectrum2d(short, 64, 33, 64, 64).power;
    let differing = 0;
    for (let i = 0; i < expected.length; i++) if (!Object.is(got[i], expected[i])) differing++;
    expect(differing).toBe(0);
  });
});
