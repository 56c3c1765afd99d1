import { describe, expect, it } from "vitest";
import { decodeImage, encodePng, ImagingError } from "@/lib/imaging";
import { makeNoise } from "@/lib/synthetic";

async function codeOf(p: Promise<unknown>): Promise<string | undefined> {
  try {
    await p;
  } catch (e) {
    return e instanceof ImagingError ? e.code : "other";
  }
  return undefined;
}

describe("decode errors (exact messages)", () => {
  it("refuses an image above the pixel limit from its header", async () => {
    const png = await encodePng(makeNoise({ width: 64, height: 32 }));
    await expect(decodeImage(png, { maxPixels: 1000 })).rejects.toThrow(
      "The image is 64×32 = 2048 pixels, above the limit of 1000 pixels.",
    );
    expect(await codeOf(decodeImage(png, { maxPixels: 1000 }))).toBe("too_large");
  });
  it("reports a truncated PNG as corrupt", async () => {
    const png = await encodePng(makeNoise({ width: 64, height: 64 }));
    const cut = png.subarray(0, Math.floor(png.length * 0.6));
    expect(await codeOf(decodeImage(cut))).toBe("corrupt");
    await expect(decodeImage(cut)).rejects.toThrow(
      /^The PNG file could not be decoded; it may be truncated or damaged/,
    );
  });
  it("reports non-image bytes as unsupported", async () => {
    await expect(decodeImage(Buffer.from("x,y\n1,2\n"))).rejects.toThrow(
      /^The file is not a readable PNG, JPEG or TIFF image/,
    );
  });
  it("rejects a channel the image does not have", async () => {
    const png = await encodePng(makeNoise({ width: 8, height: 8 }));
    await expect(decodeImage(png, { channel: 2 })).rejects.toThrow(
      "channel must be from 0 to 0 for this 1-channel image (got 2).",
    );
  });
});
