import type { GreyImage } from "../imaging/grey-image";
import {
  addCoarseRow,
  COARSE_SIGMA_PX,
  coarseFactor,
  emptyCoarseSums,
  gridRow,
  interpolateCoarseBackground,
  type CoarseBackground,
} from "./coarse-background";
import { currentSpectrumExecutor, MIN_PARALLEL_BINS, type SpectrumExecutor } from "../fft";
import { MESSAGES, ReadoutError } from "./errors";
import { planeCoefficients, subtractBlur, subtractMean, subtractPlane } from "./flatten";
import type { ResolvedReadoutOptions } from "./options";
import { findSaturated, outlierLimits, outlierSampleStep } from "./outliers";
import type { PreparedRegion } from "./prepared-region";
import { takeRegionStats } from "./region-stats";
import { reusedFloat32 } from "./reused-buffer";
import { runResidualRows, WRITE_NONE, WRITE_PLANE, WRITE_RESIDUAL, type ResidualRowsJob } from "./residual-rows";
import { findTissueOnBinned, tissueSearchFactor, type TissueRegion } from "./tissue-mask";

/** What the background pass computes per pixel: the value before and after the background. */
interface Source {
  src: Float32Array;
  /** Plane subtracted from the stored values first ("auto" flattening), else null. */
  plane: { c0: number; c1: number; c2: number } | null;
}

/** The value `prepareRegion` holds at pixel (x, y) before the background: stored, or minus the plane (rounded as it stores it). */
function sourceRow(s: Source, y: number, width: number, out: Float32Array): void {
  const row = y * width;
  if (!s.plane) {
    out.set(s.src.subarray(row, row + width));
    return;
  }
  const { c0, c1, c2 } = s.plane;
  const base = c0 + c2 * y;
  for (let x = 0; x < width; x++) out[x] = s.src[row + x] - (base + c1 * x);
}

/**
 * prepareRegion for the commonest case, a whole frame (no ROI, no mask, no inversion, no
 * binning) with the robust defaults, in two passes over the pixels instead of about nine: the
 * region's statistics with the background's grid sums; then the residual (data − background),
 * checked against the outlier limits and binned for the tissue search, with the flattened copy
 * written on the way ("auto": the residual itself; "plane": the pixels less the plane). A third
 * pass rewrites the copy where that could not be done (a tissue found, "blur" or "none"). Every
 * number is the one the general path gives (the same sums in the same order, the same float32
 * roundings). With `reuse`, the flattened copy is an array reused by the next call
 * (reusedFloat32). Returns null where that path must run instead: clipped pixels or outliers to
 * treat, a small frame, other options.
 */
export function prepareWholeFrame(
  image: GreyImage,
  settings: ResolvedReadoutOptions,
  reuse = false,
): PreparedRegion | null {
  const { width, height, data: src } = image;
  if (settings.roi || settings.excludeMask || settings.invert) return null;
  if (Math.max(width, height) > settings.maxAnalysisSidePx) return null;
  const auto = settings.outliers === "auto";
  const wantTissue = settings.tissueMask === "auto";
  if (!(auto || wantTissue || settings.flatten === "auto")) return null;
  const sigmaPx = settings.blurSigmaPx ?? Math.min(width, height) / 8;
  const tf = tissueSearchFactor(width, height);
  if (sigmaPx < COARSE_SIGMA_PX || (wantTissue && tf <= 1)) return null;
  const grid = emptyCoarseSums(width, height, coarseFactor(sigmaPx));
  // Pass 1: the region's statistics (and, without the plane first, the grid sums on the way).
  const plain = settings.flatten !== "auto";
  const stats = takeRegionStats(src, width, height, plain ? grid : null);
  if (auto && findSaturated(src, width, height, stats)) return null;
  const planeSums = { sumZ: stats.sumZ, sumXZ: stats.sumXZ, sumYZ: stats.sumYZ };
  const source: Source = { src, plane: plain ? null : planeCoefficients(width, height, planeSums) };
  if (!plain && !source.plane) return null;
  const line = new Float32Array(width);
  if (!plain)
    for (let y = 0; y < height; y++) {
      sourceRow(source, y, width, line);
      addCoarseRow(grid, line, 0, y, width);
    }
  const bg = interpolateCoarseBackground(grid, width, height, sigmaPx, true);
  const limits = auto ? outlierLimits(sampleResidual(source, bg, width, height)) : null;
  // Pass 2: the residual, on the fly; and the flattened copy, which stands unless a tissue is found.
  // Reused across readouts when the caller keeps nothing of the region after its call (readWavelength).
  // With a second thread (and the pixels in shared memory, as the TIFF reader leaves them) pass 2 is split by rows.
  const executor = currentSpectrumExecutor();
  const split =
    executor?.splitRows && src.buffer instanceof SharedArrayBuffer && width * height >= MIN_PARALLEL_BINS
      ? executor
      : null;
  const data = reuse
    ? reusedFloat32("prepared-region", width * height)
    : split
      ? new Float32Array(new SharedArrayBuffer(4 * width * height))
      : new Float32Array(width * height);
  const write: Write =
    settings.flatten === "auto"
      ? { kind: "residual" }
      : settings.flatten === "plane"
        ? { kind: "plane", plane: planeCoefficients(width, height, planeSums) }
        : { kind: "none" };
  const pass = residualPass(source, bg, width, height, limits, wantTissue ? tf : 0, data, write, split);
  if (!pass) return null; // outliers to treat: the general path replaces them
  const tissue: TissueRegion =
    wantTissue && pass.binned
      ? findTissueOnBinned(pass.binned.residual, pass.binned.intensity, tf, width, height, null)
      : { mask: null, fraction: 1 };
  let scale = 0;
  for (let i = 0; i < src.length; i += 97) scale = Math.max(scale, Math.abs(src[i]));
  // Pass 3, only where pass 2 could not write the flattened copy: inside a tissue, or another flattening.
  const included = tissue.mask;
  let known: number | null = null;
  if (pass.wrote && !included) known = pass.known;
  else if (settings.flatten === "plane" && !included) known = subtractPlane(data, width, height, null, planeSums, src);
  else {
    for (let y = 0; y < height; y++) {
      sourceRow(source, y, width, line);
      data.set(line, y * width);
    }
    if (settings.flatten === "plane") subtractPlane(data, width, height, included);
    else if (settings.flatten !== "none") subtractBlur(data, width, height, included, sigmaPx);
  }
  const sd = known !== null && !included ? known : subtractMean(data, included);
  if (!(sd > 1e-6 * Math.max(1, scale))) throw new ReadoutError("no_variation", MESSAGES.noVariation, "image");
  return {
    data,
    width,
    height,
    included,
    binFactor: 1,
    pixelSizeUm: settings.pixelSizeUm,
    x0: 0,
    y0: 0,
    tissueMask: tissue.mask,
    tissueFraction: tissue.fraction,
    treatedSaturatedPx: 0,
    treatedBrightPx: 0,
    treatedDarkPx: 0,
  };
}

/**
 * The residual at every k-th pixel (outlierSampleStep): findOutliers' sample, without the residual
 * stored. Each sampled value is computed where it lies (sourceRow's value there, the same rounding),
 * without copying the rows it falls in.
 */
function sampleResidual(s: Source, bg: CoarseBackground, width: number, height: number): Float32Array {
  const n = width * height,
    step = outlierSampleStep(n);
  const out = new Float32Array(Math.ceil(n / step));
  const { src, plane } = s;
  let k = 0;
  for (let i = 0; i < n; i += step) {
    const y = (i / width) | 0,
      x = i - y * width;
    const v = plane ? Math.fround(src[i] - (plane.c0 + plane.c2 * y + plane.c1 * x)) : src[i];
    const { y0, y1, ty } = gridRow(y, bg.f, bg.bh);
    out[k++] = v - (bg.rows[y0 * width + x] * (1 - ty) + bg.rows[y1 * width + x] * ty) - bg.offset;
  }
  return out;
}

interface ResidualPass {
  /** The residual and the intensity binned by the tissue search's factor, as binPixels bins them. */
  binned: {
    residual: { data: Float32Array; width: number; height: number; included: null };
    intensity: { data: Float32Array; width: number; height: number; included: null };
  } | null;
  /** Whether `data` now holds the flattened copy for a region without a tissue mask, and its SD if known. */
  wrote: boolean;
  known: number | null;
}

/**
 * One pass computing the residual (rounded to float32 as the general path stores it), returning
 * null if a value lies beyond the outlier limits, and binning the residual and the intensity
 * by `tf` (0: no binning) in binPixels' order (residual-rows.ts, per row).
 */
function residualPass(
  { src, plane: sourcePlane }: Source,
  bg: CoarseBackground,
  width: number,
  height: number,
  limits: { upper: number; lower: number } | null,
  tf: number,
  data: Float32Array,
  write: Write,
  split: SpectrumExecutor | null,
): ResidualPass | null {
  const w = tf > 0 ? Math.floor(width / tf) : 0,
    h = tf > 0 ? Math.floor(height / tf) : 0;
  const plane = write.kind === "plane" ? write.plane : null;
  const shared = (n: number) => (split ? new Float32Array(new SharedArrayBuffer(4 * n)) : new Float32Array(n));
  const job: ResidualRowsJob = {
    src,
    width,
    height,
    sourcePlane: sourcePlane ? Float64Array.of(sourcePlane.c0, sourcePlane.c1, sourcePlane.c2) : new Float64Array(0),
    bgRows: bg.rows,
    bgF: bg.f,
    bgBh: bg.bh,
    bgOffset: bg.offset,
    upper: limits ? limits.upper : Infinity,
    lower: limits ? limits.lower : -Infinity,
    tf,
    binnedResidual: shared(w * h),
    binnedIntensity: shared(w * h),
    data,
    write: write.kind === "residual" ? WRITE_RESIDUAL : plane ? WRITE_PLANE : WRITE_NONE,
    writePlane: plane ? Float64Array.of(plane.c0, plane.c1, plane.c2) : new Float64Array(0),
    rowSums: split ? new Float64Array(new SharedArrayBuffer(16 * height)) : new Float64Array(2 * height),
  };
  // The split falls on a whole row of the tissue search's blocks, so each thread bins whole blocks.
  const block = tf > 0 ? tf : 1;
  const at = block * Math.round(height / 2 / block);
  const both = split ? split.splitRows!("residual-rows", job, at, height, () => runResidualRows(job, 0, at)) : null;
  if (!(both ?? runResidualRows(job, 0, height))) return null;
  // [Σv, Σv²] added row after row, in row order.
  let s1 = 0,
    s2 = 0;
  for (let y = 0; y < height; y++) {
    s1 += job.rowSums[2 * y];
    s2 += job.rowSums[2 * y + 1];
  }
  const toData = write.kind === "residual";
  const grid = (g: Float32Array) => ({ data: g, width: w, height: h, included: null });
  const n = width * height;
  let known: number | null = null;
  if (toData)
    known = n > 1 ? Math.sqrt(s2 / (n - 1)) : 0; // as writeResidual
  else if (plane && n >= 2) {
    // As subtractPlane: the residual's SD when its mean is zero to rounding, else null (centre it then).
    const mean = s1 / n;
    const sd = Math.sqrt(Math.max(0, (s2 - n * mean * mean) / (n - 1)));
    known = Math.abs(mean) <= 1e-6 * sd ? sd : null;
  }
  return {
    binned: tf > 0 ? { residual: grid(job.binnedResidual), intensity: grid(job.binnedIntensity) } : null,
    wrote: toData || (plane !== null && n >= 2),
    known,
  };
}

/** What pass 2 also writes: the flattened copy of "auto" (the residual) or of "plane", or nothing. */
type Write =
  { kind: "residual" } | { kind: "plane"; plane: { c0: number; c1: number; c2: number } | null } | { kind: "none" };
