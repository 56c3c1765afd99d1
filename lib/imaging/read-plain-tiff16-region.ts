/**
 * A region of a single-page, uncompressed, 16-bit grey TIFF in strips (the commonest export of
 * microscopes and slide scanners; read-plain-tiff16.ts tells one), read row by row straight from
 * the file and reduced by a `factor × factor` box average on the way: the same numbers as the
 * sharp path (÷ 65535, then the mean of each block, partial blocks at the right and bottom
 * dropped), but only the region's rows are read, each once. Through sharp, libvips decodes such a
 * file's strips from the top for every band (measured: a 1000-row band at row 29 000 of a
 * 30 000² scan took 1.7 s, at row 0 0.2 s), so a whole scan in bands costs time quadratic in its
 * height; here it is one pass, holding one row of samples and the output.
 */
import { isImageFile, type ImageInput } from "./image-input";
import type { PixelRegion } from "./read-page-pixels";
import { littleEndianHost, type PlainTiff16Layout } from "./read-plain-tiff16";

/** Reads `region` reduced by `factor` (1 = full resolution) into Float32 scaled to 0..1. */
export function readPlainTiff16Region(
  input: ImageInput,
  layout: PlainTiff16Layout,
  region: PixelRegion,
  factor: number,
): Float32Array {
  const f = factor;
  const outW = Math.floor(region.width / f),
    outH = Math.floor(region.height / f);
  const out = new Float32Array(outW * outH);
  const srcW = outW * f;
  const norm = 1 / (65535 * f * f);
  const { le, offsets, rowsPerStrip, width } = layout;
  const rowAt = (y: number) => offsets[Math.floor(y / rowsPerStrip)] + 2 * ((y % rowsPerStrip) * width + region.x);
  for (let by = 0; by < outH; by++) {
    const o = by * outW;
    for (let y = region.y + by * f; y < region.y + (by + 1) * f; y++) {
      const samples = rowSamples(input, rowAt(y), srcW, le);
      if (f === 1) {
        for (let x = 0; x < srcW; x++) out[o + x] = samples[x];
        continue;
      }
      for (let bx = 0, x = 0; bx < outW; bx++) {
        let s = 0;
        for (const end = x + f; x < end; x++) s += samples[x];
        out[o + bx] += s;
      }
    }
    for (let i = o; i < o + outW; i++) out[i] *= norm;
  }
  return out;
}

/** `n` samples from byte `at`: in place when the bytes are in memory and aligned, else read or swapped. */
function rowSamples(input: ImageInput, at: number, n: number, le: boolean): Uint16Array {
  const bytes = isImageFile(input) ? input.read(at, 2 * n) : input.subarray(at, at + 2 * n);
  if (le === littleEndianHost && bytes.byteOffset % 2 === 0) return new Uint16Array(bytes.buffer, bytes.byteOffset, n);
  const view = new DataView(bytes.buffer, bytes.byteOffset, 2 * n);
  const samples = new Uint16Array(n);
  for (let i = 0; i < n; i++) samples[i] = view.getUint16(2 * i, le);
  return samples;
}
