import type { GreyImage } from "../imaging/grey-image";
import { checkRange, checkSize } from "./check-options";
import { makeHexSpots } from "./make-hex-spots";
import { makeStripes } from "./make-stripes";
import { createRng } from "./random";

export interface MicroscopeFrameOptions {
  width: number;
  height: number;
  /** The pattern, or none (a background-only control). */
  pattern: "stripes" | "spots" | "none";
  /** Fourier wavelength of the pattern (px): the stripe period, or the row spacing (√3/2)·a of the spots. */
  wavelengthPx?: number;
  /** @default 0 */
  angleDeg?: number;
  /** Peak of a centred Gaussian illumination bump (vignetting), in units of the pattern's amplitude. @default 0 */
  vignetting?: number;
  /** Linear ramp across x from 0 to this, in units of the pattern's amplitude. @default 0 */
  gradient?: number;
  /** Illumination multiplies the pattern (I = B·(1 + p)) instead of adding to it (I = B + p). @default false */
  multiplicative?: boolean;
  /** SD of Gaussian white noise after the blur (camera noise), in units of the pattern's amplitude. @default 0 */
  noise?: number;
  /** SD of a Gaussian blur (point-spread function) applied to the specimen before the noise (px). @default 0 */
  blurSigmaPx?: number;
  /** @default 1 */
  seed?: string | number;
}

/** MicroscopeFrameOptions checked, every default filled in (the pattern's own options are checked by its generator). */
export type ResolvedMicroscopeFrameOptions = Required<MicroscopeFrameOptions>;

/** Checks and defaults the options once, before any work; throws SyntheticOptionError naming the option and its limit. */
export function resolveMicroscopeFrameOptions(o: MicroscopeFrameOptions): ResolvedMicroscopeFrameOptions {
  const {
    width,
    height,
    pattern,
    wavelengthPx = 16,
    angleDeg = 0,
    vignetting = 0,
    gradient = 0,
    multiplicative = false,
    noise = 0,
    blurSigmaPx = 0,
    seed = 1,
  } = o;
  checkSize(width, height);
  checkRange("vignetting", vignetting, 0, 1000);
  checkRange("gradient", gradient, -1000, 1000);
  checkRange("noise", noise, 0, 100);
  checkRange("blurSigmaPx", blurSigmaPx, 0, 64);
  return {
    width,
    height,
    pattern,
    wavelengthPx,
    angleDeg,
    vignetting,
    gradient,
    multiplicative,
    noise,
    blurSigmaPx,
    seed,
  };
}

/**
 * A microscope-like frame whose wavelength is exact by construction: a unit-amplitude pattern
 * (stripes or hexagonal spots), a smooth illumination (a centred Gaussian bump of width 0.6 of
 * the half-diagonal plus a ramp), optionally multiplying the pattern, a Gaussian blur, then white
 * noise. With `pattern: "none"` the same frame without a pattern, which must read as no period.
 */
export function makeMicroscopeFrame(o: MicroscopeFrameOptions): GreyImage {
  const {
    width,
    height,
    pattern,
    wavelengthPx: lambda,
    angleDeg,
    vignetting,
    gradient,
    multiplicative,
    noise,
    blurSigmaPx,
    seed,
  } = resolveMicroscopeFrameOptions(o);
  const p =
    pattern === "stripes"
      ? makeStripes({ width, height, wavelengthPx: lambda, angleDeg })
      : pattern === "spots"
        ? makeHexSpots({ width, height, spacingPx: lambda / (Math.sqrt(3) / 2), angleDeg })
        : { width, height, data: new Float32Array(width * height) };
  const rng = createRng(seed);
  const cx = width / 2,
    cy = height / 2,
    r2 = cx * cx + cy * cy;
  let data: Float32Array = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const light = 1 + vignetting * Math.exp(-((x - cx) ** 2 + (y - cy) ** 2) / (0.36 * r2)) + (gradient * x) / width;
      const v = pattern === "none" ? 0 : p.data[i] - 0.5;
      data[i] = multiplicative ? light * (1 + v) : light + v;
    }
  }
  if (blurSigmaPx > 0) data = gaussianBlur(data, width, height, blurSigmaPx);
  if (noise > 0) for (let i = 0; i < data.length; i++) data[i] += noise * rng.normal();
  return { width, height, data };
}

/** Separable Gaussian blur with a kernel of ±3σ, edges clamped. */
export function gaussianBlur(data: Float32Array, width: number, height: number, sigma: number): Float32Array {
  const r = Math.ceil(3 * sigma);
  const k = Float64Array.from({ length: 2 * r + 1 }, (_, j) => Math.exp(-((j - r) ** 2) / (2 * sigma * sigma)));
  const sum = k.reduce((a, b) => a + b, 0);
  for (let j = 0; j < k.length; j++) k[j] /= sum;
  const tmp = new Float32Array(data.length),
    out = new Float32Array(data.length);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      let s = 0;
      for (let j = -r; j <= r; j++) s += k[j + r] * data[y * width + Math.min(width - 1, Math.max(0, x + j))];
      tmp[y * width + x] = s;
    }
  }
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      let s = 0;
      for (let j = -r; j <= r; j++) s += k[j + r] * tmp[Math.min(height - 1, Math.max(0, y + j)) * width + x];
      out[y * width + x] = s;
    }
  }
  return out;
}
