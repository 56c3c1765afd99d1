import type { GreyImage } from "../imaging/grey-image";
import { binPixels } from "./bin-pixels";
import { MESSAGES, ReadoutError } from "./errors";
import { subtractBlur, subtractMean, subtractPlane } from "./flatten";
import type { ResolvedReadoutOptions } from "./options";
import { extractRoi } from "./roi";

/** The region after ROI, inversion, binning and background flattening (not yet windowed). */
export interface PreparedRegion {
  data: Float32Array;
  width: number;
  height: number;
  included: Uint8Array | null;
  /** Integer binning applied to fit the analysis limit (1 = none). */
  binFactor: number;
  /** Pixel size of `data` (µm/px) = source pixel size × binFactor. */
  pixelSizeUm: number;
  /** Top-left of the region in source pixels. */
  x0: number;
  y0: number;
}

export const MIN_REGION_SIDE_PX = 16;

export function prepareRegion(image: GreyImage, settings: ResolvedReadoutOptions): PreparedRegion {
  const roi = extractRoi(image, settings.roi ?? undefined, settings.excludeMask ?? undefined);
  let { data, width, height, included } = roi;
  if (width < MIN_REGION_SIDE_PX || height < MIN_REGION_SIDE_PX) {
    throw new ReadoutError("too_small", MESSAGES.tooSmall(width, height, MIN_REGION_SIDE_PX), "roi");
  }
  if (settings.invert) for (let i = 0; i < data.length; i++) data[i] = -data[i];
  let binFactor = 1;
  while (Math.max(width, height) / binFactor > settings.maxAnalysisSidePx) binFactor++;
  if (binFactor > 1) ({ data, width, height, included } = binPixels(data, width, height, included, binFactor));
  let scale = 0;
  for (let i = 0; i < data.length; i += 97) scale = Math.max(scale, Math.abs(data[i]));
  if (settings.flatten === "plane") subtractPlane(data, width, height, included);
  else if (settings.flatten === "blur")
    subtractBlur(data, width, height, included, settings.blurSigmaPx ?? Math.min(width, height) / 8);
  const sd = subtractMean(data, included);
  if (!(sd > 1e-6 * Math.max(1, scale))) throw new ReadoutError("no_variation", MESSAGES.noVariation, "image");
  return {
    data,
    width,
    height,
    included,
    binFactor,
    pixelSizeUm: settings.pixelSizeUm * binFactor,
    x0: roi.x0,
    y0: roi.y0,
  };
}
