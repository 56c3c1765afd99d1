import sharp, { type Metadata, type OutputInfo } from "sharp";
import type { GreyImage } from "./grey-image";
import { ImagingError } from "./errors";
import { readPixelSize, type PixelSizeSource } from "./pixel-size";
import { readPlainTiff16 } from "./read-plain-tiff16";

/** Largest image decoded (px): 8192 × 8192 = 67 108 864, i.e. 256 MiB as Float32. */
export const MAX_DECODE_PIXELS = 67_108_864;

export interface DecodeOptions {
  /** Channel index (0-based) or "luminance" (Rec. 709 weights on the stored values). @default "luminance" */
  channel?: number | "luminance";
  /** Refuse images with more pixels than this, before decoding. @default 67108864 */
  maxPixels?: number;
}

export interface DecodedInfo {
  width: number;
  height: number;
  channels: number;
  bitDepth: 8 | 16;
  format: "png" | "jpeg" | "tiff";
  /** From the file's metadata (µm/px), null when absent or a writer's default. */
  pixelSizeUm: number | null;
  pixelSizeSource: PixelSizeSource;
  pixelSizeNote: string | null;
  /** What `image` holds. */
  channelUsed: number | "luminance";
}

export interface DecodedImage {
  /** Values scaled to 0..1 (÷255 or ÷65535). */
  image: GreyImage;
  info: DecodedInfo;
}

/** ITU-R BT.709 luma weights (applied to the stored, gamma-encoded values). */
const REC709 = [0.2126, 0.7152, 0.0722];

/**
 * Decodes PNG, JPEG or TIFF (8/16-bit, grey or multi-channel) into one Float32 channel.
 * The size is checked from the header first, so an oversized file is refused without decoding.
 * @throws ImagingError: too_large, corrupt, unsupported, bad_option
 */
export async function decodeImage(bytes: Uint8Array, options: DecodeOptions = {}): Promise<DecodedImage> {
  const maxPixels = options.maxPixels ?? MAX_DECODE_PIXELS;
  const channel = options.channel ?? "luminance";
  if (channel !== "luminance" && !(Number.isInteger(channel) && channel >= 0)) {
    throw new ImagingError(
      "bad_option",
      `channel must be a channel index from 0 or "luminance" (got ${String(channel)}).`,
      "channel",
    );
  }
  const plain = readPlainTiff16(bytes, channel, maxPixels); // fast path: uncompressed grey 16-bit, one page
  if (plain) return plain;
  const input = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let meta: Metadata;
  try {
    meta = await sharp(input, { limitInputPixels: false }).metadata();
  } catch (e) {
    throw new ImagingError(
      "unsupported",
      `The file is not a readable PNG, JPEG or TIFF image (${(e as Error).message}).`,
    );
  }
  const format = meta.format;
  if (format !== "png" && format !== "jpeg" && format !== "tiff") {
    throw new ImagingError("unsupported", `Images must be PNG, JPEG or TIFF (this file is ${String(format)}).`);
  }
  const width = meta.width ?? 0,
    height = meta.height ?? 0;
  if (width * height > maxPixels) {
    throw new ImagingError(
      "too_large",
      `The image is ${width}×${height} = ${width * height} pixels, above the limit of ${maxPixels} pixels.`,
    );
  }
  const channels = meta.channels ?? 1;
  if (channel !== "luminance" && channel >= channels) {
    throw new ImagingError(
      "bad_option",
      `channel must be from 0 to ${channels - 1} for this ${channels}-channel image (got ${channel}).`,
      "channel",
    );
  }
  const sixteen = meta.depth === "ushort" || meta.depth === "short";
  let raw: { data: Buffer; info: OutputInfo };
  try {
    // STACK.md §7: 16-bit samples need an explicit 16-bit colourspace, or sharp squashes them to 8 bits.
    const pipe = sharp(input, { limitInputPixels: false, failOn: "truncated" });
    raw = sixteen
      ? await pipe
          .toColourspace(channels >= 3 ? "rgb16" : "grey16")
          .raw({ depth: "ushort" })
          .toBuffer({ resolveWithObject: true })
      : await (channels >= 3 ? pipe : pipe.toColourspace("b-w")).raw().toBuffer({ resolveWithObject: true });
  } catch (e) {
    throw new ImagingError(
      "corrupt",
      `The ${format.toUpperCase()} file could not be decoded; it may be truncated or damaged (${(e as Error).message}).`,
    );
  }
  const n = width * height;
  const got = raw.info.channels;
  const samples = sixteen ? new Uint16Array(raw.data.buffer, raw.data.byteOffset, raw.data.length / 2) : raw.data;
  if (samples.length < n * got)
    throw new ImagingError("corrupt", `The ${format.toUpperCase()} file holds fewer pixels than its header declares.`);
  const scale = 1 / (sixteen ? 65535 : 255);
  const data = new Float32Array(n);
  if (channel === "luminance" && got >= 3) {
    for (let i = 0; i < n; i++)
      data[i] =
        (REC709[0] * samples[i * got] + REC709[1] * samples[i * got + 1] + REC709[2] * samples[i * got + 2]) * scale;
  } else {
    const c = channel === "luminance" ? 0 : Math.min(channel, got - 1);
    for (let i = 0; i < n; i++) data[i] = samples[i * got + c] * scale;
  }
  const px = readPixelSize(bytes, format, meta.density);
  return {
    image: { width, height, data },
    info: { width, height, channels, bitDepth: sixteen ? 16 : 8, format, ...px, channelUsed: channel },
  };
}
