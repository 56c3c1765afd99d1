import { describe, expect, it } from "vitest";
import { ReadoutError, readWavelength } from "@/lib/readout";
import { makeStripes } from "@/lib/synthetic";

const img = makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0 });

function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (e) {
    return e instanceof ReadoutError ? e.code : "other";
  }
  return undefined;
}

describe("readout errors (exact messages and codes)", () => {
  it.each([
    [
      () => readWavelength(img, {}),
      "missing_pixel_size",
      "pixelSizeUm is required: the image has no pixel size in its metadata, so give it in µm/px.",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: 1, roi: { kind: "rect", x: 10, y: 10, width: 0, height: 20 } }),
      "zero_area_roi",
      "The region of interest contains no pixels: give a rectangle or polygon with a positive area inside the image.",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: 1, roi: { kind: "rect", x: 100, y: 0, width: 20, height: 20 } }),
      "zero_area_roi",
      "The region of interest contains no pixels: give a rectangle or polygon with a positive area inside the image.",
    ],
    [
      () => readWavelength({ width: 32, height: 32, data: new Float32Array(1024).fill(0.4) }, { pixelSizeUm: 1 }),
      "no_variation",
      "The region of interest has no intensity variation (all included pixels are equal after background flattening), so there is no pattern to read.",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: 1, maxPixels: 1000 }),
      "too_large",
      "The image has 4096 pixels, above the readout limit of 1000 pixels.",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: 1, roi: { kind: "rect", x: 0, y: 0, width: 10, height: 40 } }),
      "too_small",
      "The region of interest (10×40 px) is too small: both sides must be at least 16 px.",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: -2 }),
      "bad_option",
      "pixelSizeUm must be a number above 0 and at most 1000000 µm/px (got -2).",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: 1, lowCutCycles: 0 }),
      "bad_option",
      "lowCutCycles must be a number from 1 to 64 cycles per region (got 0).",
    ],
    [
      () => readWavelength(img, { pixelSizeUm: 1, excludeMask: new Uint8Array(3) }),
      "bad_option",
      "excludeMask must have one byte per image pixel, 4096 (got 3).",
    ],
  ])("%#", (fn, code, message) => {
    expect(fn).toThrow(message);
    expect(codeOf(fn)).toBe(code);
  });
  it("a linear ramp has no variation after plane flattening (the plane fits it exactly)", () => {
    const ramp = {
      width: 32,
      height: 32,
      data: Float32Array.from({ length: 1024 }, (_, i) => (i % 32) / 64 + Math.floor(i / 32) / 128),
    };
    expect(codeOf(() => readWavelength(ramp, { pixelSizeUm: 1 }))).toBe("no_variation");
  });
});
