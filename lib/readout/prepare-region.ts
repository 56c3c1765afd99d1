import type { GreyImage } from "../imaging/grey-image";
import { binPixels } from "./bin-pixels";
import { MESSAGES, ReadoutError } from "./errors";
import { blurResidual, subtractBlur, subtractMean, subtractPlane } from "./flatten";
import type { ResolvedReadoutOptions } from "./options";
import { findSaturated } from "./outliers";
import { treatOutliers } from "./treat-outliers";
import { extractRoi, type RegionStats } from "./roi";
import { findTissueRegion } from "./tissue-mask";
import { prepareWholeFrame } from "./prepare-whole-frame";
import type { PreparedRegion } from "./prepared-region";

export type { PreparedRegion };

export const MIN_REGION_SIDE_PX = 16;

/** Any-pixel binning of a mask, matching binPixels' grid. */
function binMask(mask: Uint8Array, width: number, f: number, w: number, h: number): Uint8Array {
  const out = new Uint8Array(w * h);
  for (let y = 0; y < h * f; y++)
    for (let x = 0; x < w * f; x++) if (mask[y * width + x]) out[((y / f) | 0) * w + ((x / f) | 0)] = 1;
  return out;
}

/**
 * The region ready for the FFT. `reuse`: the caller keeps nothing of the result after its own
 * synchronous call (readWavelength), so a whole frame's flattened copy may be a reused array.
 */
export function prepareRegion(image: GreyImage, settings: ResolvedReadoutOptions, reuse = false): PreparedRegion {
  // A whole frame with the defaults: the same numbers in two or three passes over the pixels.
  return prepareWholeFrame(image, settings, reuse) ?? prepareRegionStepByStep(image, settings);
}

/** Every case, one step after another (prepareWholeFrame gives the same numbers where it applies). */
export function prepareRegionStepByStep(image: GreyImage, settings: ResolvedReadoutOptions): PreparedRegion {
  const roi = extractRoi(image, settings.roi ?? undefined, settings.excludeMask ?? undefined);
  let { data, width, height, included } = roi;
  if (width < MIN_REGION_SIDE_PX || height < MIN_REGION_SIDE_PX) {
    throw new ReadoutError("too_small", MESSAGES.tooSmall(width, height, MIN_REGION_SIDE_PX), "roi");
  }
  const auto = settings.outliers === "auto";
  // Saturation is a property of the stored values: found before inversion and binning.
  let saturated = auto ? findSaturatedIn(data, width, height, included, roi.stats) : null;
  if (settings.invert) for (let i = 0; i < data.length; i++) data[i] = -data[i];
  // The plane fit's sums from the copying pass, while the pixels are still the copied ones (negated if inverted).
  const sign = settings.invert ? -1 : 1;
  let planeSums: { sumZ: number; sumXZ: number; sumYZ: number } | undefined = {
    sumZ: sign * roi.stats.sumZ,
    sumXZ: sign * roi.stats.sumXZ,
    sumYZ: sign * roi.stats.sumYZ,
  };
  let binFactor = 1;
  while (Math.max(width, height) / binFactor > settings.maxAnalysisSidePx) binFactor++;
  if (binFactor > 1) {
    planeSums = undefined;
    const sourceWidth = width;
    ({ data, width, height, included } = binPixels(data, width, height, included, binFactor));
    if (saturated) saturated = { ...saturated, mask: binMask(saturated.mask, sourceWidth, binFactor, width, height) };
  }
  let scale = 0;
  for (let i = 0; i < data.length; i += 97) scale = Math.max(scale, Math.abs(data[i]));
  const sigmaPx = settings.blurSigmaPx ?? Math.min(width, height) / 8;
  if (settings.flatten === "auto") subtractPlane(data, width, height, included, planeSums);
  // The background model behind the outlier and tissue search (and the "auto" flattening when nothing changes).
  const background =
    auto || settings.tissueMask === "auto" || settings.flatten === "auto"
      ? blurResidual(data, width, height, included, sigmaPx)
      : null;
  const residual = background?.residual ?? null;
  const treated =
    auto && residual
      ? treatOutliers(data, residual, width, height, included, saturated?.mask ?? null)
      : { changed: false, saturated: 0, bright: 0, dark: 0 };
  const tissue =
    settings.tissueMask === "auto" && residual
      ? findTissueRegion(residual, data, width, height, included)
      : { mask: null, fraction: 1 };
  if (tissue.mask) {
    if (included) for (let i = 0; i < included.length; i++) included[i] &= tissue.mask[i];
    else included = tissue.mask.slice();
  }
  // An SD known from the flattening pass (centred already) spares subtractMean's two passes.
  let known: number | null = null;
  if (settings.flatten === "auto") {
    if (tissue.mask || treated.changed || !background) subtractBlur(data, width, height, included, sigmaPx);
    else ({ residual: data, sd: known } = background);
  } else if (settings.flatten === "plane")
    known = subtractPlane(data, width, height, included, treated.changed || tissue.mask ? undefined : planeSums);
  else if (settings.flatten === "blur") subtractBlur(data, width, height, included, sigmaPx);
  const sd = known !== null && !included ? known : subtractMean(data, included);
  if (!(sd > 1e-6 * Math.max(1, scale))) throw new ReadoutError("no_variation", MESSAGES.noVariation, "image");
  const perSource = binFactor * binFactor;
  return {
    data,
    width,
    height,
    included,
    binFactor,
    pixelSizeUm: settings.pixelSizeUm * binFactor,
    x0: roi.x0,
    y0: roi.y0,
    tissueMask: tissue.mask,
    tissueFraction: tissue.fraction,
    treatedSaturatedPx: saturated ? saturated.count : 0,
    treatedBrightPx: treated.bright * perSource,
    treatedDarkPx: treated.dark * perSource,
  };
}

/** Saturated pixels among the analysed ones, with their count in source pixels. */
function findSaturatedIn(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  stats: RegionStats,
): { mask: Uint8Array; count: number } | null {
  const mask = findSaturated(data, width, height, stats);
  if (!mask) return null;
  let count = 0;
  for (let i = 0; i < mask.length; i++) {
    if (included && !included[i]) mask[i] = 0;
    count += mask[i];
  }
  return count > 0 ? { mask, count } : null;
}
