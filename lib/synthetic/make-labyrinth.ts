import type { GreyImage } from "../imaging/grey-image";
import { SyntheticOptionError, addNoiseAndClamp, checkAtLeast, checkRange, checkSize } from "./check-options";
import { createRng } from "./random";

export interface LabyrinthOptions {
  width: number;
  height: number;
  /** Dominant wavelength (px), at least 2. */
  wavelengthPx: number;
  /** Number of superposed plane waves with random directions and phases. @default 48 */
  waves?: number;
  /** Gain of the tanh that sharpens the field into labyrinth-like bands; 0 leaves it smooth. @default 3 */
  sharpness?: number;
  /** SD of added Gaussian white noise. @default 0 */
  noise?: number;
  /** @default 1 */
  seed?: string | number;
}

/** LabyrinthOptions checked, every default filled in. */
export type ResolvedLabyrinthOptions = Required<LabyrinthOptions>;

/** Checks and defaults the options once, before any work; throws SyntheticOptionError naming the option and its limit. */
export function resolveLabyrinthOptions(options: LabyrinthOptions): ResolvedLabyrinthOptions {
  const { width, height, wavelengthPx, waves = 48, sharpness = 3, noise = 0, seed = 1 } = options;
  checkSize(width, height);
  checkAtLeast("wavelengthPx", wavelengthPx, 2);
  if (!Number.isInteger(waves) || waves < 1 || waves > 1000) {
    throw new SyntheticOptionError("waves", `waves must be an integer from 1 to 1000 (got ${waves}).`);
  }
  checkRange("sharpness", sharpness, 0, 100);
  checkRange("noise", noise, 0, 10);
  return { width, height, wavelengthPx, waves, sharpness, noise, seed };
}

/**
 * An isotropic labyrinth: a sum of plane waves with |k| = 2π/λ, uniformly random directions and
 * phases (a Gaussian random field whose spectrum is a thin ring, by the central limit theorem),
 * sharpened by tanh into bands. Its radial spectrum peaks at 1/λ; its angular spectrum is flat.
 */
export function makeLabyrinth(options: LabyrinthOptions): GreyImage {
  const { width, height, wavelengthPx, waves, sharpness, noise, seed } = resolveLabyrinthOptions(options);
  const rng = createRng(seed);
  const k = (2 * Math.PI) / wavelengthPx;
  const field = new Float64Array(width * height);
  const colPhase = new Float64Array(width);
  for (let w = 0; w < waves; w++) {
    const theta = Math.PI * rng.uniform();
    const phi = 2 * Math.PI * rng.uniform();
    const kx = k * Math.cos(theta);
    const ky = k * Math.sin(theta);
    for (let x = 0; x < width; x++) colPhase[x] = kx * x + phi;
    for (let y = 0; y < height; y++) {
      const row = y * width;
      const py = ky * y;
      for (let x = 0; x < width; x++) field[row + x] += Math.cos(colPhase[x] + py);
    }
  }
  // Each wave has variance ½, so the sum has SD √(waves/2); scale to unit SD before the tanh.
  const scale = 1 / Math.sqrt(waves / 2);
  const data = new Float32Array(width * height);
  for (let i = 0; i < data.length; i++) {
    const v = field[i] * scale;
    data[i] = sharpness > 0 ? 0.5 + 0.5 * Math.tanh(sharpness * v) : 0.5 + v / 6;
  }
  addNoiseAndClamp(data, noise, rng.normal);
  return { width, height, data };
}
