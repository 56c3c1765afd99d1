import type { GreyImage } from "../imaging/grey-image";
import { checkSize } from "./check-options";
import { createRng } from "./random";

export interface NoiseOptions {
  width: number;
  height: number;
  /** @default 1 */
  seed?: string | number;
}

/** NoiseOptions checked, every default filled in. */
export type ResolvedNoiseOptions = Required<NoiseOptions>;

/** Checks and defaults the options once, before any work; throws SyntheticOptionError naming the option and its limit. */
export function resolveNoiseOptions(options: NoiseOptions): ResolvedNoiseOptions {
  const { width, height, seed = 1 } = options;
  checkSize(width, height);
  return { width, height, seed };
}

/** Uniform white noise on [0, 1): a pattern-free control (flat expected power spectrum). */
export function makeNoise(options: NoiseOptions): GreyImage {
  const { width, height, seed } = resolveNoiseOptions(options);
  const rng = createRng(seed);
  const data = new Float32Array(width * height);
  for (let i = 0; i < data.length; i++) data[i] = rng.uniform();
  return { width, height, data };
}
