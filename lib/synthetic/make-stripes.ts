import type { GreyImage } from "../imaging/grey-image";
import { addNoiseAndClamp, checkAtLeast, checkRange, checkSize } from "./check-options";
import { createRng } from "./random";

export interface StripesOptions {
  /** Columns (px). */
  width: number;
  /** Rows (px). */
  height: number;
  /** Distance between neighbouring stripe centres (px); at least 2 (Nyquist). */
  wavelengthPx: number;
  /**
   * Direction of the wave vector (perpendicular to the stripes), degrees from the +x axis (columns)
   * towards +y (rows, downwards on screen). 0 gives vertical stripes.
   */
  angleDeg: number;
  /** Peak-to-peak amplitude, 0..1. @default 1 */
  contrast?: number;
  /** SD of added Gaussian white noise, in intensity units (0..1 scale). @default 0 */
  noise?: number;
  /** Seed for the noise. @default 1 */
  seed?: string | number;
  /** Phase offset (radians). @default 0 */
  phaseRad?: number;
}

/** StripesOptions checked, every default filled in. */
export type ResolvedStripesOptions = Required<StripesOptions>;

/** Checks and defaults the options once, before any work; throws SyntheticOptionError naming the option and its limit. */
export function resolveStripesOptions(options: StripesOptions): ResolvedStripesOptions {
  const { width, height, wavelengthPx, angleDeg, contrast = 1, noise = 0, seed = 1, phaseRad = 0 } = options;
  checkSize(width, height);
  checkAtLeast("wavelengthPx", wavelengthPx, 2);
  checkRange("angleDeg", angleDeg, -360, 360);
  checkRange("contrast", contrast, 0, 1);
  checkRange("noise", noise, 0, 10);
  return { width, height, wavelengthPx, angleDeg, contrast, noise, seed, phaseRad };
}

/** Sinusoidal stripes I = ½ + ½·contrast·cos(2π(x cosθ + y sinθ)/λ + φ), clamped to 0..1 after noise. */
export function makeStripes(options: StripesOptions): GreyImage {
  const { width, height, wavelengthPx, angleDeg, contrast, noise, seed, phaseRad } = resolveStripesOptions(options);
  const theta = (angleDeg * Math.PI) / 180;
  const kx = (2 * Math.PI * Math.cos(theta)) / wavelengthPx;
  const ky = (2 * Math.PI * Math.sin(theta)) / wavelengthPx;
  const data = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    for (let x = 0; x < width; x++) data[row + x] = 0.5 + 0.5 * contrast * Math.cos(kx * x + ky * y + phaseRad);
  }
  addNoiseAndClamp(data, noise, createRng(seed).normal);
  return { width, height, data };
}
