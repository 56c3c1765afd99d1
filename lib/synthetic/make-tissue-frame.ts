import type { GreyImage } from "../imaging/grey-image";
import { checkRange, SyntheticOptionError } from "./check-options";
import { gaussianBlur, resolveMicroscopeFrameOptions, type MicroscopeFrameOptions } from "./make-microscope-frame";
import { makeHexSpots } from "./make-hex-spots";
import { makeStripes } from "./make-stripes";
import { createRng, type Rng } from "./random";
import { tissueSignedDistance, type TissueShape } from "./tissue-shape";

/** Where the tissue lies and what surrounds it (the slide or mounting medium). */
export interface TissueOptions {
  shape: TissueShape;
  /** Fraction of the frame covered by tissue, 0.05..0.95 (the shape is scaled to it). */
  coverage: number;
  /** A dark slide (fluorescence, level 0.3) or a bright one (level 4); tissue sits at level 2. */
  slide: "dark" | "bright";
  /** Width of the soft tissue edge (px). @default 6 */
  edgePx?: number;
  /** Rotation of the ellipse (degrees). @default 20 */
  angleDeg?: number;
  /** SD of the slide's own noise, in units of the pattern's amplitude. @default 0.05 */
  slideNoise?: number;
}

export interface TissueFrameOptions extends MicroscopeFrameOptions {
  /** Tissue covering part of the frame; null = the pattern fills the frame. @default null */
  tissue?: TissueOptions | null;
  /** Bright debris disks (radius 2–5 px, 30× the pattern's amplitude) that saturate the detector. @default 0 */
  debrisCount?: number;
  /**
   * "bright": debris adds light (fluorescent dust) and saturates; "dark": opaque particles pass 5 %
   * of the light there, as in brightfield, without reaching the detector's floor. @default "bright"
   */
  debrisContrast?: "bright" | "dark";
  /** Low-count shot noise: mean photon count per unit of intensity (Poisson, seeded); 0 = none. @default 0 */
  photonsPerUnit?: number;
  /** 8-bit output in which this fraction of the specimen's brightest pixels clips at 255. @default 0 (float) */
  saturatedFraction?: number;
  /** Brightfield contrast: dark pattern on light tissue. @default false */
  brightfield?: boolean;
}

/** A frame and the truth the generator knows about it. */
export interface TissueFrame {
  image: GreyImage;
  /** 1 where the tissue weight is ≥ ½ (the tissue region), per pixel. */
  tissueMask: Uint8Array;
  /** Pixels at the stored maximum (clipped spots and debris cores). */
  saturatedPixels: number;
  /** Pixels covered by debris disks (before the blur). */
  debrisPixels: number;
  /** Pixels that are saturated or debris (the pixels an outlier treatment should replace). */
  outlierPixels: number;
}

const TISSUE_LEVEL = 2;
const SLIDE_LEVEL = { dark: 0.3, bright: 4 } as const;
const DEBRIS_LEVEL = 30;
/** Fraction of the light an opaque debris particle lets through (brightfield). */
const DARK_DEBRIS_TRANSMISSION = 0.05;

/** Poisson draw: Knuth's product method below a mean of 30, the normal approximation above (Knuth, TAOCP 2, §3.4.1). */
function poisson(rng: Rng, mean: number): number {
  if (mean <= 0) return 0;
  if (mean >= 30) return Math.max(0, Math.round(mean + Math.sqrt(mean) * rng.normal()));
  const limit = Math.exp(-mean);
  let k = 0,
    p = rng.uniform();
  while (p > limit) {
    k++;
    p *= rng.uniform();
  }
  return k;
}

/** The value at quantile q of a sample of the data (every few pixels). */
function quantileOf(data: Float32Array, q: number, skip: Uint8Array | null): number {
  const sample: number[] = [];
  const step = Math.max(1, Math.floor(data.length / 200_000));
  for (let i = 0; i < data.length; i += step) if (!skip || !skip[i]) sample.push(data[i]);
  sample.sort((a, b) => a - b);
  return sample[Math.min(sample.length - 1, Math.floor(q * sample.length))];
}

/**
 * A microscope frame of tissue on a slide, its wavelength exact by construction: the pattern
 * (unit amplitude, inverted for brightfield) only on the tissue, whose soft edge blends into a
 * slide of its own level and noise; then illumination (vignetting and ramp, added or multiplying),
 * debris disks, the point-spread blur, camera noise, shot noise and detector saturation.
 */
export function makeTissueFrame(o: TissueFrameOptions): TissueFrame {
  const r = resolveMicroscopeFrameOptions(o);
  const { width, height, pattern, wavelengthPx: lambda, angleDeg, vignetting, gradient, multiplicative } = r;
  const debrisCount = o.debrisCount ?? 0;
  const photons = o.photonsPerUnit ?? 0;
  const satFraction = o.saturatedFraction ?? 0;
  checkRange("debrisCount", debrisCount, 0, 1000);
  checkRange("photonsPerUnit", photons, 0, 1e6);
  checkRange("saturatedFraction", satFraction, 0, 0.5);
  const tissue = o.tissue ?? null;
  if (tissue) {
    checkRange("tissue.coverage", tissue.coverage, 0.05, 0.95);
    if (tissue.slide !== "dark" && tissue.slide !== "bright")
      throw new SyntheticOptionError("tissue.slide", `tissue.slide must be "dark" or "bright" (got ${tissue.slide}).`);
  }
  const edgePx = tissue?.edgePx ?? 6;
  const distance = tissue
    ? tissueSignedDistance(tissue.shape, width, height, tissue.coverage, tissue.angleDeg ?? 20)
    : null;
  const p =
    pattern === "stripes"
      ? makeStripes({ width, height, wavelengthPx: lambda, angleDeg })
      : pattern === "spots"
        ? makeHexSpots({ width, height, spacingPx: lambda / (Math.sqrt(3) / 2), angleDeg })
        : null;
  const rng = createRng(r.seed);
  const sign = o.brightfield ? -1 : 1;
  const slideLevel = tissue ? SLIDE_LEVEL[tissue.slide] : TISSUE_LEVEL;
  const slideNoise = tissue?.slideNoise ?? 0.05;
  const tissueMask = new Uint8Array(width * height);
  const cx = width / 2,
    cy = height / 2,
    r2 = cx * cx + cy * cy;
  let data: Float32Array = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const d = distance ? distance(x, y) : Infinity;
      const t = 1 / (1 + Math.exp((-4 * d) / edgePx)); // logistic edge, ~edgePx wide
      tissueMask[i] = d >= 0 ? 1 : 0;
      const v = p ? sign * (p.data[i] - 0.5) : 0;
      const specimen = (1 - t) * (slideLevel + slideNoise * rng.normal()) + t * (TISSUE_LEVEL + v);
      const light = 1 + vignetting * Math.exp(-((x - cx) ** 2 + (y - cy) ** 2) / (0.36 * r2)) + (gradient * x) / width;
      data[i] = multiplicative ? light * specimen : light - 1 + specimen;
    }
  }
  const debris = new Uint8Array(width * height);
  for (let k = 0; k < debrisCount; k++) {
    const dx = rng.uniform() * width,
      dy = rng.uniform() * height,
      rad = 2 + 3 * rng.uniform();
    for (let y = Math.max(0, Math.floor(dy - rad)); y <= Math.min(height - 1, Math.ceil(dy + rad)); y++)
      for (let x = Math.max(0, Math.floor(dx - rad)); x <= Math.min(width - 1, Math.ceil(dx + rad)); x++)
        if ((x - dx) ** 2 + (y - dy) ** 2 <= rad * rad) debris[y * width + x] = 1;
  }
  // The clip level is chosen before the debris is added: it is a property of the specimen's exposure.
  let clip = Infinity;
  if (satFraction > 0) clip = quantileOf(data, 1 - satFraction, null);
  const darkDebris = o.debrisContrast === "dark";
  if (o.debrisContrast !== undefined && o.debrisContrast !== "bright" && !darkDebris)
    throw new SyntheticOptionError(
      "debrisContrast",
      `debrisContrast must be "bright" or "dark" (got ${String(o.debrisContrast)}).`,
    );
  for (let i = 0; i < data.length; i++)
    if (debris[i]) data[i] = darkDebris ? DARK_DEBRIS_TRANSMISSION * data[i] : data[i] + DEBRIS_LEVEL;
  if (r.blurSigmaPx > 0) data = gaussianBlur(data, width, height, r.blurSigmaPx);
  for (let i = 0; i < data.length; i++) {
    let v = data[i] + (r.noise > 0 ? r.noise * rng.normal() : 0);
    if (photons > 0) v = poisson(rng, Math.max(0, v) * photons) / photons;
    data[i] = v;
  }
  if (satFraction === 0 && debrisCount > 0 && !darkDebris) {
    let top = -Infinity;
    for (let i = 0; i < data.length; i++) if (!debris[i] && data[i] > top) top = data[i];
    clip = Math.fround(1.5 * top); // debris cores saturate; the specimen does not (a stored float32 value)
  }
  let saturatedPixels = 0;
  if (Number.isFinite(clip)) {
    let low = Infinity;
    for (const v of data) low = Math.min(low, v);
    low = Math.min(0, low);
    for (let i = 0; i < data.length; i++) {
      // 8-bit when a fraction of the specimen saturates (the camera's stored range), otherwise clipped floats.
      const v = Math.min(clip, data[i]);
      data[i] = satFraction > 0 ? Math.round((255 * (v - low)) / (clip - low)) : v;
    }
    const top = satFraction > 0 ? 255 : clip;
    for (const v of data) if (v >= top) saturatedPixels++;
  }
  let debrisPixels = 0,
    outlierPixels = 0;
  const top = satFraction > 0 ? 255 : clip;
  for (let i = 0; i < debris.length; i++) {
    debrisPixels += debris[i];
    if (debris[i] || data[i] >= top) outlierPixels++;
  }
  return { image: { width, height, data }, tissueMask, saturatedPixels, debrisPixels, outlierPixels };
}
