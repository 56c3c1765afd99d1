/**
 * A region of a plain 16-bit TIFF, reduced or not, is read from its strips directly (from bytes or
 * from a file read by ranges) and gives the same numbers as the sharp path gives for the same
 * pixels stored deflate-compressed: ÷ 65535, box means of factor × factor, partial blocks dropped.
 */
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, describe, expect, it } from "vitest";
import { decodeImage, type DecodeOptions } from "@/lib/imaging";
import { openImageFile } from "@/lib/workers/image-file";
import { writePlainTiff16 } from "../../support/write-plain-tiff16";

const dir = mkdtempSync(path.join(tmpdir(), "morphokin-plain-region-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const W = 301,
  H = 203;
// Every pixel different (a hash of x, y), so a misplaced row or column changes the numbers.
const valueAt = (x: number, y: number) => (x * 7919 + y * 104_729 + ((x * y) % 977)) % 65_536;
const file = path.join(dir, "plain.tif");
writePlainTiff16(file, W, H, (y, row) => row.forEach((_, x) => (row[x] = valueAt(x, y))), 0.5);
const plain = readFileSync(file);

async function compressed(): Promise<Buffer> {
  const raw = new Uint16Array(W * H);
  for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) raw[y * W + x] = valueAt(x, y);
  // sharp takes the raw depth from the typed array (16 bits here).
  return sharp(raw, { raw: { width: W, height: H, channels: 1 } })
    .toColourspace("grey16")
    .tiff({ compression: "deflate" })
    .toBuffer();
}

describe("a region of a plain 16-bit TIFF read from its strips", () => {
  const cases: Array<[string, DecodeOptions]> = [
    ["a region at full resolution", { region: { x: 17, y: 9, width: 120, height: 80 } }],
    [
      "a region reduced 3×3 (partial blocks dropped)",
      { region: { x: 5, y: 11, width: 100, height: 71 }, maxSidePx: 40 },
    ],
    ["the whole image reduced 2×2", { maxSidePx: 200 }],
  ];
  for (const [name, options] of cases)
    it(`${name}: the same numbers as the sharp path, from bytes and from the file`, async () => {
      const viaSharp = await decodeImage(await compressed(), options);
      const fromBytes = await decodeImage(plain, options);
      const f = openImageFile(file);
      let fromFile: Awaited<ReturnType<typeof decodeImage>>;
      try {
        fromFile = await decodeImage(f, options);
      } finally {
        f.close();
      }
      for (const got of [fromBytes, fromFile]) {
        expect(got.image.width).toBe(viaSharp.image.width);
        expect(got.image.height).toBe(viaSharp.image.height);
        expect(got.info.reduceFactor).toBe(viaSharp.info.reduceFactor);
        let worst = 0;
        for (let i = 0; i < got.image.data.length; i++)
          worst = Math.max(worst, Math.abs(got.image.data[i] - viaSharp.image.data[i]));
        expect(worst).toBeLessThan(1e-6); // Float32 rounding of sums of ≤ 9 samples (common practice, no source)
      }
      expect(fromFile.info.pixelSizeUm).toBeCloseTo(0.5, 9); // XResolution 20 000 px/cm as written
    });
});
