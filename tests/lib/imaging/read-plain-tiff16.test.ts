import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { decodeImage, encodeTiff16 } from "@/lib/imaging";
import { readPlainTiff16 } from "@/lib/imaging/read-plain-tiff16";
import { createRng, makeHexSpots } from "@/lib/synthetic";

/**
 * A minimal baseline TIFF (TIFF 6.0, Adobe 1992, sections 2, 3 and 7): one grey 16-bit page,
 * uncompressed, `rowsPerStrip` rows per strip, the pixel data starting `gap` bytes after the IFD
 * (an odd gap makes the samples unaligned), little- or big-endian.
 */
function writeTiff(samples: Uint16Array, width: number, height: number, rowsPerStrip: number, le: boolean, gap = 0) {
  const strips = Math.ceil(height / rowsPerStrip);
  const tags: Array<[number, number, number[]]> = [
    [256, 3, [width]],
    [257, 3, [height]],
    [258, 3, [16]],
    [259, 3, [1]],
    [262, 3, [1]],
    [273, 4, []], // strip offsets, filled below
    [277, 3, [1]],
    [278, 3, [rowsPerStrip]],
    [279, 4, Array.from({ length: strips }, (_, s) => 2 * width * Math.min(rowsPerStrip, height - s * rowsPerStrip))],
  ];
  const ifdAt = 8,
    ifdSize = 2 + tags.length * 12 + 4;
  const arraysAt = ifdAt + ifdSize;
  const pixelsAt = arraysAt + 8 * strips + gap;
  tags[5][2] = Array.from({ length: strips }, (_, s) => pixelsAt + 2 * width * s * rowsPerStrip);
  const buf = new Uint8Array(pixelsAt + 2 * samples.length);
  const v = new DataView(buf.buffer);
  v.setUint16(0, le ? 0x4949 : 0x4d4d, false);
  v.setUint16(2, 42, le);
  v.setUint32(4, ifdAt, le);
  v.setUint16(ifdAt, tags.length, le);
  let arrays = arraysAt;
  tags.forEach(([tag, type, values], e) => {
    const at = ifdAt + 2 + 12 * e,
      size = type === 3 ? 2 : 4;
    v.setUint16(at, tag, le);
    v.setUint16(at + 2, type, le);
    v.setUint32(at + 4, values.length, le);
    let off = at + 8;
    if (values.length * size > 4) {
      v.setUint32(at + 8, arrays, le);
      off = arrays;
      arrays += values.length * size;
    }
    values.forEach((x, i) => (size === 2 ? v.setUint16(off + 2 * i, x, le) : v.setUint32(off + 4 * i, x, le)));
  });
  v.setUint32(ifdAt + 2 + 12 * tags.length, 0, le);
  samples.forEach((x, i) => v.setUint16(pixelsAt + 2 * i, x, le));
  return buf;
}

/** The sharp path's reading of the same file (decode.ts before the fast path): grey16 raw ÷ 65535 as Float32. */
async function sharpValues(bytes: Uint8Array): Promise<Float32Array> {
  const raw = await sharp(bytes).toColourspace("grey16").raw({ depth: "ushort" }).toBuffer();
  const u16 = new Uint16Array(raw.buffer, raw.byteOffset, raw.length / 2);
  return Float32Array.from(u16, (x) => x * (1 / 65535));
}

const countDiffering = (a: Float32Array, b: Float32Array) => a.reduce((n, x, i) => n + (x === b[i] ? 0 : 1), 0);

describe("readPlainTiff16 (fast path for uncompressed grey 16-bit TIFF)", () => {
  const rng = createRng(11);
  const width = 37,
    height = 29;
  const samples = Uint16Array.from({ length: width * height }, () => Math.floor(rng.uniform() * 65536));

  it.each([
    ["little-endian, 8 rows per strip", true, 8, 0],
    ["big-endian, 5 rows per strip", false, 5, 0],
    ["little-endian, unaligned samples, one strip", true, 29, 1],
  ] as const)("reads the same values as sharp: %s", async (_, le, rowsPerStrip, gap) => {
    const bytes = writeTiff(samples, width, height, rowsPerStrip, le, gap);
    const fast = readPlainTiff16(bytes, "luminance", 1e9);
    expect(fast).not.toBeNull();
    expect([fast!.info.width, fast!.info.height, fast!.info.bitDepth]).toEqual([width, height, 16]);
    expect(countDiffering(fast!.image.data, await sharpValues(bytes))).toBe(0);
  });

  it("reads Morphokin's own TIFF export with its pixel size, as decodeImage did through sharp", async () => {
    const img = makeHexSpots({ width: 64, height: 48, spacingPx: 9, noise: 0.05, seed: 4 });
    const bytes = await encodeTiff16(img, { pixelSizeUm: 0.325 });
    const fast = readPlainTiff16(bytes, 0, 1e9);
    expect(fast).not.toBeNull();
    expect(fast!.info.pixelSizeUm).toBeCloseTo(0.325, 6);
    expect(countDiffering(fast!.image.data, await sharpValues(bytes))).toBe(0);
  });

  it("leaves compressed files, other channels and oversized images to sharp", async () => {
    const bytes = writeTiff(samples, width, height, 8, true);
    expect(readPlainTiff16(bytes, 1, 1e9)).toBeNull();
    expect(readPlainTiff16(bytes, "luminance", width * height - 1)).toBeNull();
    const deflated = await sharp(bytes).toColourspace("grey16").tiff({ compression: "deflate" }).toBuffer();
    expect(readPlainTiff16(deflated, "luminance", 1e9)).toBeNull();
    const { image } = await decodeImage(deflated);
    expect(countDiffering(image.data, await sharpValues(bytes))).toBe(0);
  });
});
