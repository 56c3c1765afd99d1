import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { encodePng, encodeTiff16 } from "@/lib/imaging";
import { readTiffTags } from "@/lib/imaging/read-tiff-tags";
import { makeStripes } from "@/lib/synthetic";

async function rawGrey16(buf: Buffer): Promise<Uint16Array> {
  // STACK.md §7: grey16 colourspace is needed to read 16-bit samples back correctly.
  const { data } = await sharp(buf)
    .toColourspace("grey16")
    .raw({ depth: "ushort" })
    .toBuffer({ resolveWithObject: true });
  return new Uint16Array(data.buffer, data.byteOffset, data.length / 2);
}

describe("encodePng / encodeTiff16 round trips (sharp as the reader)", () => {
  const img = makeStripes({ width: 37, height: 21, wavelengthPx: 6, angleDeg: 30 });

  it("16-bit PNG keeps one channel and values to 1/65535", async () => {
    const buf = await encodePng(img, { bitDepth: 16 });
    const meta = await sharp(buf).metadata();
    expect([meta.format, meta.depth, meta.channels, meta.width, meta.height]).toEqual(["png", "ushort", 1, 37, 21]);
    const px = await rawGrey16(buf);
    for (let i = 0; i < px.length; i += 17)
      expect(Math.abs(px[i] / 65535 - img.data[i])).toBeLessThanOrEqual(0.5 / 65535 + 1e-7);
  });

  it("8-bit PNG is single-channel grey, values to 1/255, and invert gives 255 − v", async () => {
    const plain = await encodePng(img);
    const inv = await encodePng(img, { invert: true });
    const meta = await sharp(plain).metadata();
    expect([meta.depth, meta.channels]).toEqual(["uchar", 1]);
    const a = await sharp(plain).extractChannel(0).raw().toBuffer();
    const b = await sharp(inv).extractChannel(0).raw().toBuffer();
    for (let i = 0; i < a.length; i += 13) {
      expect(Math.abs(a[i] / 255 - img.data[i])).toBeLessThanOrEqual(0.5 / 255 + 1e-6);
      expect(a[i] + b[i]).toBe(255);
    }
  });

  it("16-bit TIFF is uncompressed grey16 with the pixel size in its resolution tags", async () => {
    const buf = await encodeTiff16(img, { pixelSizeUm: 0.65 });
    const meta = await sharp(buf).metadata();
    expect([meta.format, meta.depth, meta.channels]).toEqual(["tiff", "ushort", 1]);
    const tags = readTiffTags(buf)!;
    expect(tags.resolutionUnit).toBe(3); // TIFF 6.0: 3 = centimetre
    // 1 cm = 10⁴ µm, so px/cm = 10⁴ / (µm/px)
    expect(1e4 / tags.xResolution!).toBeCloseTo(0.65, 6);
    expect(1e4 / tags.yResolution!).toBeCloseTo(0.65, 6);
    const px = await rawGrey16(buf);
    expect(px[40] / 65535).toBeCloseTo(img.data[40], 4);
  });
});
