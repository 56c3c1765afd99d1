import { describe, expect, it } from "vitest";
import { encodePng, encodeTiff16 } from "@/lib/imaging";

const img = { width: 2, height: 2, data: new Float32Array(4) };

describe("encode errors (exact messages)", () => {
  it("rejects a bit depth other than 8 or 16", async () => {
    await expect(encodePng(img, { bitDepth: 12 as 8 })).rejects.toThrow("bitDepth must be 8 or 16 (got 12).");
  });
  it("rejects a non-positive pixel size", async () => {
    await expect(encodeTiff16(img, { pixelSizeUm: 0 })).rejects.toThrow(
      "pixelSizeUm must be a finite number above 0 and at most 1000000 µm/px (got 0).",
    );
  });
  it("rejects data of the wrong length", async () => {
    await expect(encodePng({ width: 3, height: 2, data: new Float32Array(4) })).rejects.toThrow(
      "image must have integer width and height ≥ 1 and data of length width·height (got 3×2, length 4).",
    );
  });
});
