import { ReadoutError, MESSAGES } from "./errors";
import type { FlattenMethod } from "./flatten";
import type { Roi } from "./roi";
import type { TissueMaskMode } from "./tissue-mask";
import type { WindowKind } from "./window";

/** Regions with a longer side are binned by an integer factor to this side (px) unless set otherwise. */
export const DEFAULT_MAX_ANALYSIS_SIDE_PX = 4096;

/** Largest source image the readout accepts (px): 8192 × 8192. */
export const MAX_READOUT_PIXELS = 67_108_864;
/** Default significance threshold: peak ÷ background ≥ 5 (design choice, see README). */
export const DEFAULT_SIGNIFICANCE_THRESHOLD = 5;

export interface ReadoutOptions {
  /** Pixel size (µm/px). Required: from the file's metadata or the uploader. */
  pixelSizeUm?: number | null;
  /** Region of interest in source pixels. @default the whole image */
  roi?: Roi | null;
  /** One byte per source pixel, non-zero = exclude. @default none */
  excludeMask?: Uint8Array | null;
  /** Negate intensities (dark-on-light patterns). The spectrum is unchanged; previews are not. @default false */
  invert?: boolean;
  /** Background removal: "auto" = plane, then a Gaussian background of σ = blurSigmaPx. @default "auto" */
  flatten?: FlattenMethod;
  /** Find the tissue inside the region by its texture and analyse only there. @default "auto" */
  tissueMask?: TissueMaskMode;
  /** Replace saturated pixels and bright debris by their surroundings. @default "auto" */
  outliers?: "auto" | "off";
  /** SD of the Gaussian background for `flatten: "auto"` and `"blur"` (px of the analysed grid). @default shorter side / 8 */
  blurSigmaPx?: number;
  /** @default "hann" */
  window?: WindowKind;
  /** Taper fraction of the Tukey window, 0..1. @default 0.25 */
  tukeyAlpha?: number;
  /** Lowest frequency searched and fitted, in cycles per region side (rings of width 1/N). @default 2 */
  lowCutCycles?: number;
  /** Peak ÷ background at or above which a period is reported. @default 5 */
  significanceThreshold?: number;
  /** Regions with a longer side are binned by an integer factor to fit (px). @default 4096 */
  maxAnalysisSidePx?: number;
  /** Source images above this many pixels are refused. @default 67108864 */
  maxPixels?: number;
  /** Estimate the uncertainty from 3 × 3 overlapping sub-regions. @default true */
  subregions?: boolean;
  /** Autocorrelation cross-check. @default true */
  autocorrelation?: boolean;
}

export type ResolvedReadoutOptions = Required<
  Omit<ReadoutOptions, "roi" | "excludeMask" | "blurSigmaPx" | "pixelSizeUm">
> & {
  pixelSizeUm: number;
  roi: Roi | null;
  excludeMask: Uint8Array | null;
  blurSigmaPx: number | null;
};

function bad(field: string, message: string): never {
  throw new ReadoutError("bad_option", message, field);
}

function checkNumber(field: string, v: number, lo: number, hi: number, unit = ""): void {
  if (!Number.isFinite(v) || v < lo || v > hi)
    bad(field, `${field} must be a number from ${lo} to ${hi}${unit} (got ${v}).`);
}

/** Validates and defaults the options once, before any pixel is touched. */
export function resolveReadoutOptions(
  o: ReadoutOptions,
  imageWidth: number,
  imageHeight: number,
): ResolvedReadoutOptions {
  const maxPixels = o.maxPixels ?? MAX_READOUT_PIXELS;
  if (imageWidth * imageHeight > maxPixels)
    throw new ReadoutError("too_large", MESSAGES.tooLarge(imageWidth * imageHeight, maxPixels), "image");
  if (o.pixelSizeUm === undefined || o.pixelSizeUm === null)
    throw new ReadoutError("missing_pixel_size", MESSAGES.missingPixelSize, "pixelSizeUm");
  if (!Number.isFinite(o.pixelSizeUm) || o.pixelSizeUm <= 0 || o.pixelSizeUm > 1e6) {
    bad("pixelSizeUm", `pixelSizeUm must be a number above 0 and at most 1000000 µm/px (got ${o.pixelSizeUm}).`);
  }
  const flatten = o.flatten ?? "auto";
  if (!["auto", "plane", "blur", "none"].includes(flatten))
    bad("flatten", `flatten must be "auto", "plane", "blur" or "none" (got ${String(flatten)}).`);
  const tissueMask = o.tissueMask ?? "auto";
  if (!["auto", "off"].includes(tissueMask))
    bad("tissueMask", `tissueMask must be "auto" or "off" (got ${String(tissueMask)}).`);
  const outliers = o.outliers ?? "auto";
  if (!["auto", "off"].includes(outliers))
    bad("outliers", `outliers must be "auto" or "off" (got ${String(outliers)}).`);
  const window = o.window ?? "hann";
  if (!["hann", "tukey", "none"].includes(window))
    bad("window", `window must be "hann", "tukey" or "none" (got ${String(window)}).`);
  const tukeyAlpha = o.tukeyAlpha ?? 0.25;
  checkNumber("tukeyAlpha", tukeyAlpha, 0, 1);
  const lowCutCycles = o.lowCutCycles ?? 2;
  checkNumber("lowCutCycles", lowCutCycles, 1, 64, " cycles per region");
  const significanceThreshold = o.significanceThreshold ?? DEFAULT_SIGNIFICANCE_THRESHOLD;
  checkNumber("significanceThreshold", significanceThreshold, 1, 1e6);
  const maxAnalysisSidePx = o.maxAnalysisSidePx ?? DEFAULT_MAX_ANALYSIS_SIDE_PX;
  checkNumber("maxAnalysisSidePx", maxAnalysisSidePx, 64, 8192, " px");
  if (o.blurSigmaPx !== undefined) checkNumber("blurSigmaPx", o.blurSigmaPx, 1, 4096, " px");
  if (o.excludeMask && o.excludeMask.length !== imageWidth * imageHeight) {
    bad(
      "excludeMask",
      `excludeMask must have one byte per image pixel, ${imageWidth * imageHeight} (got ${o.excludeMask.length}).`,
    );
  }
  if (o.roi?.kind === "rect") {
    for (const k of ["x", "y", "width", "height"] as const)
      if (!Number.isFinite(o.roi[k])) bad("roi", `roi.${k} must be a finite number of pixels (got ${o.roi[k]}).`);
  }
  return {
    pixelSizeUm: o.pixelSizeUm,
    roi: o.roi ?? null,
    excludeMask: o.excludeMask ?? null,
    invert: o.invert ?? false,
    flatten,
    tissueMask,
    outliers,
    blurSigmaPx: o.blurSigmaPx ?? null,
    window,
    tukeyAlpha,
    lowCutCycles,
    significanceThreshold,
    maxAnalysisSidePx,
    maxPixels,
    subregions: o.subregions ?? true,
    autocorrelation: o.autocorrelation ?? true,
  };
}
