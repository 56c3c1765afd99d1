import type { GreyImage } from "../imaging/grey-image";
import { addNoiseAndClamp, checkAtLeast, checkRange, checkSize } from "./check-options";
import { createRng } from "./random";

export interface GradientStripesOptions {
  width: number;
  height: number;
  /** Local wavelength at x = 0 (px), at least 2. */
  wavelengthStartPx: number;
  /** Local wavelength at x = width − 1 (px), at least 2. */
  wavelengthEndPx: number;
  /** @default 1 */
  contrast?: number;
  /** SD of added Gaussian noise. @default 0 */
  noise?: number;
  /** @default 1 */
  seed?: string | number;
}

/** GradientStripesOptions checked, every default filled in. */
export type ResolvedGradientStripesOptions = Required<GradientStripesOptions>;

/** Checks and defaults the options once, before any work; throws SyntheticOptionError naming the option and its limit. */
export function resolveGradientStripesOptions(options: GradientStripesOptions): ResolvedGradientStripesOptions {
  const { width, height, wavelengthStartPx, wavelengthEndPx, contrast = 1, noise = 0, seed = 1 } = options;
  checkSize(width, height);
  checkAtLeast("wavelengthStartPx", wavelengthStartPx, 2);
  checkAtLeast("wavelengthEndPx", wavelengthEndPx, 2);
  checkRange("contrast", contrast, 0, 1);
  checkRange("noise", noise, 0, 10);
  return { width, height, wavelengthStartPx, wavelengthEndPx, contrast, noise, seed };
}

/**
 * Vertical stripes whose local wavelength λ(x) grows linearly from start to end along x.
 * The phase is φ(x) = 2π∫₀ˣ dx'/λ(x') = (2π/g)·ln(λ(x)/λ₀) with g = dλ/dx, so the local
 * wavelength 2π/φ'(x) equals λ(x) exactly (calculus).
 */
export function makeGradientStripes(options: GradientStripesOptions): GreyImage {
  const {
    width,
    height,
    wavelengthStartPx: l0,
    wavelengthEndPx: l1,
    contrast,
    noise,
    seed,
  } = resolveGradientStripesOptions(options);
  const g = width > 1 ? (l1 - l0) / (width - 1) : 0;
  const rowProfile = new Float32Array(width);
  for (let x = 0; x < width; x++) {
    const phase = Math.abs(g) < 1e-12 ? (2 * Math.PI * x) / l0 : ((2 * Math.PI) / g) * Math.log((l0 + g * x) / l0);
    rowProfile[x] = 0.5 + 0.5 * contrast * Math.cos(phase);
  }
  const data = new Float32Array(width * height);
  for (let y = 0; y < height; y++) data.set(rowProfile, y * width);
  addNoiseAndClamp(data, noise, createRng(seed).normal);
  return { width, height, data };
}

/** The exact local wavelength (px) of {@link makeGradientStripes} at column x. */
export function gradientWavelengthAtPx(
  options: Pick<GradientStripesOptions, "width" | "wavelengthStartPx" | "wavelengthEndPx">,
  x: number,
): number {
  const { width, wavelengthStartPx: l0, wavelengthEndPx: l1 } = options;
  return width > 1 ? l0 + ((l1 - l0) * x) / (width - 1) : l0;
}
