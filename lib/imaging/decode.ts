import sharp, { type Metadata } from "sharp";
import type { GreyImage } from "./grey-image";
import { ImagingError } from "./errors";
import { sharpInput, type ImageInput } from "./image-input";
import { readPixelSize, type PixelSizeSource } from "./pixel-size";
import { readPlainTiff16, readPlainTiff16Layout } from "./read-plain-tiff16";
import { readPlainTiff16Region } from "./read-plain-tiff16-region";
import { isFloatDepth, isSixteen, readPagePixels, type PixelRegion } from "./read-page-pixels";
import { readTiffPages } from "./read-tiff-pages";
import { checkStackChoice, describeStack, pageOf, type StackLayout } from "./stack-layout";

/** Largest image read (px), from its header: 30 000 × 30 000 slide scans fit, 1e9 is the hard limit. */
export const MAX_DECODE_PIXELS = 1_000_000_000;
/** Largest image held in memory at full resolution (px): 8192² = 256 MiB as Float32. Above it give `maxSidePx`. */
export const MAX_FULL_RESOLUTION_PIXELS = 67_108_864;

export interface DecodeOptions {
  /** Channel index (0-based) or "luminance" (Rec. 709 weights on the stored values). @default "luminance" */
  channel?: number | "luminance";
  /** z-plane (0-based) of a stack. @default 0 */
  plane?: number;
  /** Time point (0-based) of a stack. @default 0 */
  timePoint?: number;
  /** "max-z": maximum-intensity projection over every plane of the chosen channel and time point. @default "none" */
  projection?: "none" | "max-z";
  /** Read only this rectangle (source px, after EXIF orientation). @default the whole image */
  region?: PixelRegion | null;
  /** Read a region with a longer side above this reduced by the smallest integer factor that fits (box average). @default none */
  maxSidePx?: number | null;
  /** Refuse images with more pixels than this, before decoding. @default 1e9 */
  maxPixels?: number;
}

export interface DecodedInfo {
  /** Source size (px) after EXIF orientation. */
  width: number;
  height: number;
  /** Channels to choose from: samples per pixel, or the stack's channels when they are pages. */
  channels: number;
  bitDepth: 8 | 16 | 32;
  format: "png" | "jpeg" | "tiff";
  /** From the file's metadata (µm/px), null when absent or a writer's default. */
  pixelSizeUm: number | null;
  pixelSizeSource: PixelSizeSource;
  pixelSizeNote: string | null;
  /** What `image` holds. */
  channelUsed: number | "luminance";
  stack: StackLayout;
  planeUsed: number | null;
  timePointUsed: number;
  projection: "none" | "max-z";
  /** EXIF/TIFF orientation applied (1 = as stored). */
  orientation: number;
  /** The rectangle read (source px) and the integer factor it was reduced by (1 = full resolution). */
  region: PixelRegion;
  reduceFactor: number;
  /** Plain-language notes on choices made for the user. */
  notes: string[];
}

export interface DecodedImage {
  /** Values scaled to 0..1 (÷255 or ÷65535); 32-bit float as stored. */
  image: GreyImage;
  info: DecodedInfo;
}

async function readMetadata(input: Buffer | string): Promise<Metadata> {
  try {
    return await sharp(input, { limitInputPixels: false }).metadata();
  } catch (e) {
    throw new ImagingError(
      "unsupported",
      `The file is not a readable PNG, JPEG or TIFF image (${(e as Error).message}).`,
    );
  }
}

function clampRegion(region: PixelRegion | null | undefined, width: number, height: number): PixelRegion {
  if (!region) return { x: 0, y: 0, width, height };
  const x = Math.max(0, Math.floor(region.x)),
    y = Math.max(0, Math.floor(region.y));
  const x1 = Math.min(width, Math.ceil(region.x + region.width)),
    y1 = Math.min(height, Math.ceil(region.y + region.height));
  if (!(x1 > x && y1 > y))
    throw new ImagingError(
      "bad_option",
      `The region (${region.x}, ${region.y}, ${region.width}×${region.height} px) lies outside the ${width}×${height} image.`,
      "roi",
    );
  return { x, y, width: x1 - x, height: y1 - y };
}

/**
 * Decodes PNG, JPEG or TIFF (8/16-bit, 32-bit float; grey or multi-channel; multi-page, OME-TIFF
 * and ImageJ stacks) into one Float32 channel, upright (EXIF orientation applied). The size is
 * checked from the header first, so an oversized file is refused without decoding; a region and
 * `maxSidePx` read a large image without holding it at full resolution; a large file is given as
 * an ImageFile (image-input.ts), so its bytes are never held either.
 * @throws ImagingError: too_large, corrupt, unsupported, bad_option
 */
export async function decodeImage(source: ImageInput, options: DecodeOptions = {}): Promise<DecodedImage> {
  const maxPixels = options.maxPixels ?? MAX_DECODE_PIXELS;
  const requested = options.channel ?? "luminance";
  if (requested !== "luminance" && !(Number.isInteger(requested) && requested >= 0)) {
    throw new ImagingError(
      "bad_option",
      `channel must be a channel index from 0 or "luminance" (got ${String(requested)}).`,
      "channel",
    );
  }
  const fast = readWholePlainTiff16(source, options, requested, maxPixels);
  if (fast) return fast;
  const input = sharpInput(source);
  const meta = await readMetadata(input);
  const format = meta.format;
  if (format !== "png" && format !== "jpeg" && format !== "tiff") {
    throw new ImagingError("unsupported", `Images must be PNG, JPEG or TIFF (this file is ${String(format)}).`);
  }
  const orientation = meta.orientation ?? 1;
  const width = meta.autoOrient?.width ?? meta.width ?? 0,
    height = meta.autoOrient?.height ?? meta.height ?? 0;
  if (width * height > maxPixels) {
    throw new ImagingError(
      "too_large",
      `The image is ${width}×${height} = ${width * height} pixels, above the limit of ${maxPixels} pixels.`,
    );
  }
  const samples = meta.channels ?? 1;
  const tiff = format === "tiff" ? readTiffPages(source) : null;
  const stack = describeStack(tiff, format === "tiff" ? (meta.pages ?? 1) : 1, samples);
  const choice = {
    channel: requested,
    plane: options.plane ?? 0,
    timePoint: options.timePoint ?? 0,
    projection: options.projection ?? "none",
  };
  checkStackChoice(stack, choice);
  if (stack.channelsIn === "samples" && requested !== "luminance" && requested >= samples) {
    throw new ImagingError(
      "bad_option",
      `channel must be from 0 to ${samples - 1} for this ${samples}-channel image (got ${requested}).`,
      "channel",
    );
  }
  const notes: string[] = [];
  let channel = requested;
  let sampleChannel: number | "luminance" = requested;
  if (stack.channelsIn === "pages") {
    if (requested === "luminance") {
      channel = 0;
      notes.push(
        `This file keeps its ${stack.channels} channels as separate images; channel 1 was read (choose another in the readout settings).`,
      );
    }
    sampleChannel = "luminance";
  }
  const planes = choice.projection === "max-z" ? Array.from({ length: stack.planes }, (_, z) => z) : [choice.plane];
  const region = clampRegion(options.region, width, height);
  let factor = 1;
  const side = options.maxSidePx ?? null;
  if (side !== null) while (Math.max(region.width, region.height) / factor > side) factor++;
  if ((region.width / factor) * (region.height / factor) > MAX_FULL_RESOLUTION_PIXELS)
    throw new ImagingError(
      "too_large",
      `The region to read is ${region.width}×${region.height} pixels, above the ${MAX_FULL_RESOLUTION_PIXELS} pixels held at full resolution; read a smaller region or a reduced image.`,
    );
  // A plain 16-bit grey TIFF (one page, no compression, upright) is read from its strips directly.
  const plain =
    format === "tiff" && stack.pageCount === 1 && orientation === 1 && (channel === "luminance" || channel === 0)
      ? readPlainTiff16Layout(source)
      : null;
  let data: Float32Array | null = null;
  for (const z of planes) {
    const page = pageOf(stack, channel === "luminance" ? 0 : channel, z, choice.timePoint);
    const where = stack.pageCount > 1 ? `Page ${page + 1} of the TIFF` : `The ${format.toUpperCase()} file`;
    const described = tiff?.pages[page];
    if (described?.damage) throw new ImagingError("corrupt", described.damage);
    if (
      described &&
      tiff!.pages[0] &&
      (described.width !== tiff!.pages[0].width || described.height !== tiff!.pages[0].height)
    )
      throw new ImagingError(
        "corrupt",
        `Page ${page + 1} of the TIFF is ${described.width}×${described.height} pixels but page 1 is ${tiff!.pages[0].width}×${tiff!.pages[0].height}; the pages are not one stack.`,
      );
    if (format !== "tiff" && page > 0) throw new ImagingError("bad_option", `${where} has one page.`, "plane");
    const plane = plain
      ? readPlainTiff16Region(source, plain, region, factor)
      : await readPagePixels({
          input,
          page,
          format,
          depth: meta.depth,
          samples,
          channel: sampleChannel,
          region,
          factor,
          where,
        });
    if (!data) data = plane;
    else for (let i = 0; i < data.length; i++) if (plane[i] > data[i]) data[i] = plane[i];
  }
  const outW = Math.floor(region.width / factor),
    outH = Math.floor(region.height / factor);
  if (factor > 1)
    notes.push(
      `The image was read reduced ${factor}×${factor} (each pixel the mean of ${factor}×${factor} source pixels, the readout's own binning) to fit the ${side} px analysis limit without holding it at full resolution.`,
    );
  const px = readPixelSize(source, format, meta.density);
  // Orientations 5–8 turn the image a quarter: the stored Y pixel size becomes the upright X size.
  const turned = orientation >= 5 && orientation <= 8;
  if (turned && px.pixelSizeSource === "ome-xml" && stack.pixelSizeYUm) px.pixelSizeUm = stack.pixelSizeYUm;
  if (stack.pixelSizeXUm && stack.pixelSizeYUm && Math.abs(stack.pixelSizeYUm / stack.pixelSizeXUm - 1) > 0.01)
    px.pixelSizeNote = `The pixels are not square (PhysicalSizeX ${stack.pixelSizeXUm} µm, PhysicalSizeY ${stack.pixelSizeYUm} µm); the ${turned ? "Y size (the upright image's X)" : "X size"} is used.`;
  const bitDepth = isFloatDepth(meta.depth) ? 32 : isSixteen(meta.depth) ? 16 : 8;
  return {
    image: { width: outW, height: outH, data: data! },
    info: {
      width,
      height,
      channels: stack.channelsIn === "pages" ? stack.channels : samples,
      bitDepth,
      format,
      ...px,
      channelUsed: channel,
      stack,
      planeUsed: choice.projection === "max-z" ? null : choice.plane,
      timePointUsed: choice.timePoint,
      projection: choice.projection,
      orientation,
      region,
      reduceFactor: factor,
      notes,
    },
  };
}

/**
 * The fast path (read-plain-tiff16.ts) when the whole first page is wanted at full resolution: a
 * single-page, uncompressed grey 16-bit TIFF read straight into Float32, with the same info as the
 * general path gives for it. Anything else returns null.
 */
function readWholePlainTiff16(
  source: ImageInput,
  options: DecodeOptions,
  channel: number | "luminance",
  maxPixels: number,
): DecodedImage | null {
  if (options.region || (options.plane ?? 0) !== 0 || (options.timePoint ?? 0) !== 0) return null;
  if ((options.projection ?? "none") !== "none") return null;
  const plain = readPlainTiff16(source, channel, Math.min(maxPixels, MAX_FULL_RESOLUTION_PIXELS));
  if (!plain) return null;
  const { width, height } = plain.info;
  if (options.maxSidePx != null && Math.max(width, height) > options.maxSidePx) return null;
  return {
    image: plain.image,
    info: {
      ...plain.info,
      stack: describeStack(readTiffPages(source), 1, 1),
      planeUsed: 0,
      timePointUsed: 0,
      projection: "none",
      orientation: 1,
      region: { x: 0, y: 0, width, height },
      reduceFactor: 1,
      notes: [],
    },
  };
}
