/**
 * Large working arrays reused from one readout to the next (reusedFloat32, and |F|² with
 * reusePower) must never carry one readout's numbers into another: readouts of different frames
 * of the same size, one after another, give exactly what each gives alone in a fresh state, and a
 * reused array is handed again only for the same slot and length. Exact equality: the reuse only
 * changes where values are written (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { realPowerSpectrum2d } from "@/lib/fft";
import { readWavelength } from "@/lib/readout";
import { reusedFloat32 } from "@/lib/readout/reused-buffer";
import { makeTissueFrame } from "@/lib/synthetic";

describe("reused working arrays", () => {
  it("hands the same array again only for the same slot and length", () => {
    const a = reusedFloat32("test-slot", 1000);
    expect(reusedFloat32("test-slot", 1000)).toBe(a);
    expect(reusedFloat32("test-slot", 1001)).not.toBe(a);
    expect(reusedFloat32("other-slot", 1001)).not.toBe(reusedFloat32("test-slot", 1001));
  });

  it("a reused |F|² holds only the latest transform", () => {
    const n = 64;
    const one = Float32Array.from({ length: n * n }, (_, i) => Math.sin(i * 0.3));
    const two = Float32Array.from({ length: n * n }, (_, i) => Math.cos(i * 0.11) * ((i % 7) - 3));
    const fresh = realPowerSpectrum2d(two, n, n, n, n).power;
    const first = realPowerSpectrum2d(one, n, n, n, n, { reusePower: true }).power;
    const second = realPowerSpectrum2d(two, n, n, n, n, { reusePower: true }).power;
    expect(second).toBe(first); // the same array, overwritten
    expect(Array.from(second)).toEqual(Array.from(fresh));
  });

  it("readouts of different whole frames one after another give what each gives alone", () => {
    const frame = (pattern: "spots" | "stripes", wavelengthPx: number, seed: number) =>
      makeTissueFrame({ width: 1100, height: 1030, pattern, wavelengthPx, vignetting: 2, noise: 0.3, seed }).image;
    const a = frame("spots", 24, 1),
      b = frame("stripes", 30, 2);
    const read = (image: typeof a) => readWavelength(image, { pixelSizeUm: 1, subregions: false });
    const aFirst = read(a);
    const bAfter = read(b);
    const aAgain = read(a);
    expect(aAgain).toEqual(aFirst);
    expect(bAfter.wavelengthPx).not.toBe(aFirst.wavelengthPx);
    // The generator's exact wavelengths, within the 2 %.
    expect(Math.abs(aFirst.wavelengthPx! / 24 - 1)).toBeLessThan(0.02);
    expect(Math.abs(bAfter.wavelengthPx! / 30 - 1)).toBeLessThan(0.02);
  });
});
