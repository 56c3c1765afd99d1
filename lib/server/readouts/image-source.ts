/**
 * The image a readout analyses, read from the stored file: the chosen channel, plane and time
 * point (or the maximum over z), upright. A large image (above 8192² px) is never held at full
 * resolution: only the ROI's bounding box is read, reduced by the integer factor the readout would
 * bin it by (a box average, lib/imaging/read-page-pixels.ts), and the ROI and the pixel sizes are
 * mapped onto that reduced grid; `toSourcePx` maps lengths back. A large file comes as an ImageFile
 * (read by ranges), so its bytes are not held either.
 */
import "server-only";
import { DEFAULT_MAX_ANALYSIS_SIDE_PX } from "@/lib/readout";
import {
  decodeImage,
  MAX_FULL_RESOLUTION_PIXELS,
  readImageLayout,
  type DecodedInfo,
  type GreyImage,
  type ImageInput,
  type PixelRegion,
} from "@/lib/imaging";
import type { ImageReadoutSettings, RoiInput } from "@/lib/contracts/readout";

/** The readout's default analysis limit (ReadoutOptions.maxAnalysisSidePx): larger regions are binned to it. */
export const ANALYSIS_SIDE_PX = DEFAULT_MAX_ANALYSIS_SIDE_PX;
/** Longest side of the stored preview (px). */
export const PREVIEW_MAX_SIDE = 1024;

export interface ReadoutSource {
  image: GreyImage;
  info: DecodedInfo;
  /** The ROI in `image` pixels (null: all of `image`). */
  roi: RoiInput | null;
  /** Source px per `image` px (1 unless a large image was read reduced). */
  factor: number;
  /** Top-left of `image` in source px. */
  x0: number;
  y0: number;
  /** The whole image for the preview, when `image` is only the ROI of a large one. */
  whole: GreyImage;
}

function boundsOf(roi: RoiInput, width: number, height: number): PixelRegion {
  if (roi.kind === "rect") return { x: roi.x, y: roi.y, width: roi.width, height: roi.height };
  const xs = roi.points.map((p) => p[0]),
    ys = roi.points.map((p) => p[1]);
  const x = Math.max(0, Math.floor(Math.min(...xs))),
    y = Math.max(0, Math.floor(Math.min(...ys)));
  return {
    x,
    y,
    width: Math.min(width, Math.ceil(Math.max(...xs)) + 1) - x,
    height: Math.min(height, Math.ceil(Math.max(...ys)) + 1) - y,
  };
}

export async function readReadoutSource(input: ImageInput, settings: ImageReadoutSettings): Promise<ReadoutSource> {
  const choice = {
    channel: settings.channel,
    plane: settings.plane,
    timePoint: settings.timePoint,
    projection: settings.projection,
  };
  const layout = await readImageLayout(input);
  if (!layout || layout.width * layout.height <= MAX_FULL_RESOLUTION_PIXELS) {
    // As before: the whole image at full resolution; the readout crops and bins it.
    const { image, info } = await decodeImage(input, choice);
    return { image, info, roi: settings.roi, factor: 1, x0: 0, y0: 0, whole: image };
  }
  const region = settings.roi ? boundsOf(settings.roi, layout.width, layout.height) : null;
  const { image, info } = await decodeImage(input, { ...choice, region, maxSidePx: ANALYSIS_SIDE_PX });
  const f = info.reduceFactor,
    x0 = info.region.x,
    y0 = info.region.y;
  const roi: RoiInput | null =
    settings.roi?.kind === "polygon"
      ? { kind: "polygon", points: settings.roi.points.map(([x, y]) => [(x - x0) / f, (y - y0) / f]) }
      : null;
  const whole = region ? (await decodeImage(input, { ...choice, maxSidePx: PREVIEW_MAX_SIDE })).image : image;
  return { image, info, roi, factor: f, x0, y0, whole };
}
