/**
 * EXIF orientation is honoured (a camera JPEG reads upright), and a region read reduced by an
 * integer factor equals the readout's own binning of the same region (lib/readout/bin-pixels.ts).
 */
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { decodeImage } from "@/lib/imaging";
import { binPixels } from "@/lib/readout/bin-pixels";
import { makeNoise } from "@/lib/synthetic";
import { writeTiffPages } from "../../support/tiff-writer";

describe("EXIF orientation", () => {
  it("orientation 6 (stored rotated; display turns it 90° clockwise) reads upright", async () => {
    // Stored 40×20, left half white: shown turned 90° clockwise it is 20×40 with the top half white
    // (EXIF 2.3 Orientation tag, value 6 = "0th row at the visual right, 0th column at the top").
    const px = Buffer.alloc(40 * 20);
    for (let y = 0; y < 20; y++) for (let x = 0; x < 20; x++) px[y * 40 + x] = 255;
    const jpeg = await sharp(px, { raw: { width: 40, height: 20, channels: 1 } })
      .jpeg({ quality: 100 })
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const r = await decodeImage(jpeg);
    expect([r.info.width, r.info.height, r.image.width, r.image.height]).toEqual([20, 40, 20, 40]);
    expect(r.info.orientation).toBe(6);
    expect(r.image.data[5 * 20 + 10]).toBeGreaterThan(0.9); // top half white
    expect(r.image.data[35 * 20 + 10]).toBeLessThan(0.1); // bottom half black
  });
});

describe("regions and reduction", () => {
  const W = 203,
    H = 150;
  const noise = makeNoise({ width: W, height: H, seed: 4 });
  const tif = writeTiffPages([{ width: W, height: H, data: Array.from(noise.data, (v) => Math.round(v * 65535)) }], {
    bits: 16,
  });

  it("a region is read as the same pixels the full image has there", async () => {
    const full = await decodeImage(tif);
    const part = await decodeImage(tif, { region: { x: 30, y: 20, width: 50, height: 40 } });
    expect([part.image.width, part.image.height]).toEqual([50, 40]);
    for (const [x, y] of [
      [0, 0],
      [49, 39],
      [17, 23],
    ])
      expect(part.image.data[y * 50 + x]).toBe(full.image.data[(y + 20) * W + x + 30]);
  });

  it("maxSidePx reduces by the smallest integer factor that fits, the same as bin-pixels", async () => {
    const full = await decodeImage(tif);
    const small = await decodeImage(tif, { region: { x: 3, y: 0, width: 200, height: 150 }, maxSidePx: 64 });
    // 200 / 4 = 50 ≤ 64 < 200 / 3: factor 4 (the readout's loop in prepare-region.ts).
    expect(small.info.reduceFactor).toBe(4);
    expect([small.image.width, small.image.height]).toEqual([50, 37]);
    const crop = new Float32Array(200 * 150);
    for (let y = 0; y < 150; y++) for (let x = 0; x < 200; x++) crop[y * 200 + x] = full.image.data[y * W + x + 3];
    const binned = binPixels(crop, 200, 150, null, 4);
    for (let i = 0; i < binned.data.length; i++) expect(small.image.data[i]).toBeCloseTo(binned.data[i], 6);
    expect(small.info.notes.at(-1)).toMatch(/^The image was read reduced 4×4/);
  });
});
