import sharp, { type OutputInfo } from "sharp";
import { ImagingError } from "./errors";

/** A rectangle in source pixels (after EXIF orientation). */
export interface PixelRegion {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PageRequest {
  /** The bytes, or a file's path (libvips then reads only the strips or tiles of each band). */
  input: Buffer | string;
  /** 0-based page (TIFF). */
  page: number;
  format: string;
  /** sharp's depth of the stored samples. */
  depth: string | undefined;
  /** Channels per pixel as stored. */
  samples: number;
  /** Sample index, or "luminance" (Rec. 709 weights on the stored values). */
  channel: number | "luminance";
  region: PixelRegion;
  /** Integer box-average factor: `factor × factor` source pixels become one (1 = full resolution). */
  factor: number;
  /** A message prefix naming the page for errors, e.g. "Page 3 of the TIFF". */
  where: string;
}

/** ITU-R BT.709 luma weights (applied to the stored, gamma-encoded values). */
const REC709 = [0.2126, 0.7152, 0.0722];
/** Raw bytes decoded per band when reducing (design choice: bounds peak memory, ~10 bands for 30 000²). */
const BAND_BYTES = 64 * 1024 * 1024;

export const isFloatDepth = (depth: string | undefined) => depth === "float" || depth === "double";
export const isSixteen = (depth: string | undefined) => depth === "ushort" || depth === "short";

/** Decodes one band of rows of the region to raw samples with sharp. */
async function decodeBand(r: PageRequest, top: number, rows: number, width: number) {
  const whole = r.region.x === 0 && top === 0 && rows === r.region.height && width === r.region.width;
  let pipe = sharp(r.input, { limitInputPixels: false, failOn: "truncated", page: r.page, autoOrient: true });
  // A band of the (oriented) image: libvips reads only the strips or tiles it needs.
  if (!whole) pipe = pipe.extract({ left: r.region.x, top, width, height: rows });
  const got: { data: Buffer; info: OutputInfo } = isFloatDepth(r.depth)
    ? await pipe.raw({ depth: "float" }).toBuffer({ resolveWithObject: true })
    : isSixteen(r.depth)
      ? // STACK.md §7: 16-bit samples need an explicit 16-bit colourspace, or sharp squashes them to 8 bits.
        await pipe
          .toColourspace(r.samples >= 3 ? "rgb16" : "grey16")
          .raw({ depth: "ushort" })
          .toBuffer({ resolveWithObject: true })
      : await (r.samples >= 3 ? pipe : pipe.toColourspace("b-w")).raw().toBuffer({ resolveWithObject: true });
  const d = got.data;
  const samples = isFloatDepth(r.depth)
    ? new Float32Array(d.buffer, d.byteOffset, d.length / 4)
    : isSixteen(r.depth)
      ? new Uint16Array(d.buffer, d.byteOffset, d.length / 2)
      : d;
  return { samples, channels: got.info.channels };
}

/**
 * Reads the region of one page as one Float32 channel: 8-bit ÷ 255, 16-bit ÷ 65535, float as
 * stored. With `factor` > 1 the region is read in bands of rows and averaged over
 * `factor × factor` blocks (partial blocks at the right and bottom dropped), which is the
 * readout's own binning (lib/readout/bin-pixels.ts), so the full-resolution image never exists
 * in memory at once.
 * @throws ImagingError corrupt
 */
export async function readPagePixels(r: PageRequest): Promise<Float32Array> {
  const f = r.factor;
  const outW = Math.floor(r.region.width / f),
    outH = Math.floor(r.region.height / f);
  const out = new Float32Array(outW * outH);
  const bytesPerSample = isFloatDepth(r.depth) ? 4 : isSixteen(r.depth) ? 2 : 1;
  const scale = isFloatDepth(r.depth) ? 1 : 1 / (isSixteen(r.depth) ? 65535 : 255);
  const srcW = f === 1 ? r.region.width : outW * f;
  const blocksPerBand =
    f === 1 ? outH : Math.max(1, Math.floor(BAND_BYTES / (srcW * Math.max(1, r.samples) * bytesPerSample * f)));
  const norm = scale / (f * f);
  for (let by0 = 0; by0 < outH; by0 += blocksPerBand) {
    const blocks = Math.min(blocksPerBand, outH - by0);
    let band: Awaited<ReturnType<typeof decodeBand>>;
    try {
      band = await decodeBand(r, r.region.y + by0 * f, blocks * f, srcW);
    } catch (e) {
      throw new ImagingError(
        "corrupt",
        `${r.where} could not be decoded; it may be truncated or damaged (${(e as Error).message}).`,
      );
    }
    const { samples, channels: got } = band;
    if (samples.length < srcW * blocks * f * got)
      throw new ImagingError("corrupt", `${r.where} holds fewer pixels than its header declares.`);
    const lum = r.channel === "luminance" && got >= 3;
    const c = r.channel === "luminance" ? 0 : Math.min(r.channel, got - 1);
    const value = (i: number) =>
      lum
        ? REC709[0] * samples[i * got] + REC709[1] * samples[i * got + 1] + REC709[2] * samples[i * got + 2]
        : samples[i * got + c];
    if (f === 1) {
      for (let i = 0; i < srcW * blocks; i++) out[by0 * outW + i] = value(i) * scale;
      continue;
    }
    for (let b = 0; b < blocks; b++) {
      const row = (by0 + b) * outW;
      for (let y = b * f; y < (b + 1) * f; y++) {
        const start = y * srcW;
        if (!lum && got === 1) {
          // The common grey case without the per-sample function call (a 30 000² scan is 9·10⁸ samples).
          for (let bx = 0, x = start; bx < outW; bx++) {
            let s = 0;
            for (const end = x + f; x < end; x++) s += samples[x];
            out[row + bx] += s;
          }
        } else for (let x = 0; x < outW * f; x++) out[row + Math.floor(x / f)] += value(start + x);
      }
      for (let i = row; i < row + outW; i++) out[i] *= norm;
    }
  }
  return out;
}
