import sharp from "sharp";
import type { GreyImage } from "./grey-image";
import { ImagingError } from "./errors";

export interface EncodePngOptions {
  /** Bits per sample of the written grey PNG. @default 8 */
  bitDepth?: 8 | 16;
  /** Write 1 − v instead of v (dark-on-light becomes light-on-dark). @default false */
  invert?: boolean;
}

export interface EncodeTiffOptions {
  /** Pixel size (µm/px) written as the TIFF XResolution/YResolution tags, unit centimetre. */
  pixelSizeUm: number;
  /** Write 1 − v instead of v. @default false */
  invert?: boolean;
}

function checkImage(image: GreyImage): void {
  const { width, height, data } = image;
  if (
    !Number.isInteger(width) ||
    !Number.isInteger(height) ||
    width < 1 ||
    height < 1 ||
    data.length !== width * height
  ) {
    throw new ImagingError(
      "bad_option",
      `image must have integer width and height ≥ 1 and data of length width·height (got ${width}×${height}, length ${data.length}).`,
      "image",
    );
  }
}

/** Quantises 0..1 values (clamped; NaN → 0) to integers 0..max. */
function quantise<T extends Uint8Array | Uint16Array>(data: Float32Array, out: T, max: number, invert: boolean): T {
  for (let i = 0; i < data.length; i++) {
    let v = data[i];
    if (!(v > 0)) v = 0;
    else if (v > 1) v = 1;
    if (invert) v = 1 - v;
    out[i] = Math.round(v * max);
  }
  return out;
}

/**
 * Encodes a 0..1 grey image as a single-channel PNG (8- or 16-bit). Values outside 0..1 are clamped.
 */
export async function encodePng(image: GreyImage, options: EncodePngOptions = {}): Promise<Buffer> {
  checkImage(image);
  const { bitDepth = 8, invert = false } = options;
  if (bitDepth !== 8 && bitDepth !== 16) {
    throw new ImagingError("bad_option", `bitDepth must be 8 or 16 (got ${String(bitDepth)}).`, "bitDepth");
  }
  const raw = { width: image.width, height: image.height, channels: 1 as const };
  if (bitDepth === 16) {
    // sharp reads raw depth from the typed-array type; grey16 keeps one 16-bit channel.
    const px = quantise(image.data, new Uint16Array(image.data.length), 65535, invert);
    return sharp(px, { raw }).toColourspace("grey16").png().toBuffer();
  }
  const px = quantise(image.data, new Uint8Array(image.data.length), 255, invert);
  // Without b-w sharp writes three identical sRGB channels.
  return sharp(px, { raw }).toColourspace("b-w").png().toBuffer();
}

/**
 * Encodes a 0..1 grey image as an uncompressed 16-bit single-channel TIFF whose resolution tags
 * carry the pixel size (XResolution = YResolution = 10⁴/pixelSizeUm px/cm, ResolutionUnit = cm).
 * Uncompressed because sharp's default TIFF compression (JPEG) would reduce it to 8 bits.
 */
export async function encodeTiff16(image: GreyImage, options: EncodeTiffOptions): Promise<Buffer> {
  checkImage(image);
  const { pixelSizeUm, invert = false } = options;
  if (!Number.isFinite(pixelSizeUm) || pixelSizeUm <= 0 || pixelSizeUm > 1e6) {
    throw new ImagingError(
      "bad_option",
      `pixelSizeUm must be a finite number above 0 and at most 1000000 µm/px (got ${pixelSizeUm}).`,
      "pixelSizeUm",
    );
  }
  const px = quantise(image.data, new Uint16Array(image.data.length), 65535, invert);
  const pxPerMm = 1000 / pixelSizeUm; // sharp takes xres/yres in px/mm whatever the unit tag
  return sharp(px, { raw: { width: image.width, height: image.height, channels: 1 }, limitInputPixels: false })
    .toColourspace("grey16")
    .tiff({ compression: "none", xres: pxPerMm, yres: pxPerMm, resolutionUnit: "cm" })
    .toBuffer();
}
