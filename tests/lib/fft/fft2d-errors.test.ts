import { describe, expect, it } from "vitest";
import { fft2dInPlace, realFft2d } from "@/lib/fft";

describe("FFT errors (exact messages)", () => {
  it("rejects a size that is not a power of two", () => {
    expect(() => fft2dInPlace(new Float64Array(24), 6, 2)).toThrow(
      "FFT size must be a power of two of at least 2 (got 6).",
    );
  });
  it("rejects a buffer of the wrong length", () => {
    expect(() => fft2dInPlace(new Float64Array(10), 4, 2)).toThrow(
      "data must hold 2·width·height = 16 numbers (got 10).",
    );
  });
  it("rejects an image larger than the transform", () => {
    expect(() => realFft2d(new Float32Array(20), 5, 4, 4, 4)).toThrow(
      "the image (5×4) must fit in the transform (4×4).",
    );
  });
});
