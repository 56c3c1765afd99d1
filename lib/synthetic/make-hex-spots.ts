import type { GreyImage } from "../imaging/grey-image";
import { addNoiseAndClamp, checkAtLeast, checkPositive, checkRange, checkSize } from "./check-options";
import { createRng } from "./random";

export interface HexSpotsOptions {
  width: number;
  height: number;
  /** Nearest-neighbour distance a between spot centres (px), at least 3. */
  spacingPx: number;
  /** Direction of one lattice vector, degrees from +x towards +y (rows down). @default 0 */
  angleDeg?: number;
  /** Spot radius at half maximum (px) of the Gaussian spot profile. @default 0.25·spacingPx */
  spotRadiusPx?: number;
  /** SD of a Gaussian displacement of each spot centre, per axis (px). @default 0 */
  jitterPx?: number;
  /** SD of added Gaussian white noise. @default 0 */
  noise?: number;
  /** @default 1 */
  seed?: string | number;
}

/** HexSpotsOptions checked, every default filled in. */
export type ResolvedHexSpotsOptions = Required<HexSpotsOptions>;

/** Checks and defaults the options once, before any work; throws SyntheticOptionError naming the option and its limit. */
export function resolveHexSpotsOptions(options: HexSpotsOptions): ResolvedHexSpotsOptions {
  const { width, height, spacingPx: a, angleDeg = 0, jitterPx = 0, noise = 0, seed = 1 } = options;
  checkSize(width, height);
  checkAtLeast("spacingPx", a, 3);
  const spotRadiusPx = options.spotRadiusPx ?? 0.25 * a;
  checkRange("angleDeg", angleDeg, -360, 360);
  checkPositive("spotRadiusPx", spotRadiusPx);
  checkRange("jitterPx", jitterPx, 0, a);
  checkRange("noise", noise, 0, 10);
  return { width, height, spacingPx: a, angleDeg, spotRadiusPx, jitterPx, noise, seed };
}

/** Bright Gaussian spots (peak 1 on 0) on a hexagonal lattice centred on the image centre. */
export function makeHexSpots(options: HexSpotsOptions): GreyImage {
  const {
    width,
    height,
    spacingPx: a,
    angleDeg,
    spotRadiusPx,
    jitterPx,
    noise,
    seed,
  } = resolveHexSpotsOptions(options);
  const rng = createRng(seed);
  const t = (angleDeg * Math.PI) / 180;
  const t2 = t + Math.PI / 3;
  const [a1x, a1y, a2x, a2y] = [a * Math.cos(t), a * Math.sin(t), a * Math.cos(t2), a * Math.sin(t2)];
  const sigma = spotRadiusPx / Math.sqrt(2 * Math.log(2));
  const reach = Math.ceil(3.5 * sigma);
  const inv2s2 = 1 / (2 * sigma * sigma);
  const cx = width / 2;
  const cy = height / 2;
  const halfDiag = Math.hypot(width, height) / 2 + reach + a;
  // Lattice rows are (√3/2)a apart, so this many steps in i or j covers the disc of radius halfDiag.
  const n = Math.ceil(halfDiag / (a * (Math.sqrt(3) / 2))) + 1;
  const data = new Float32Array(width * height);
  for (let i = -n; i <= n; i++) {
    for (let j = -n; j <= n; j++) {
      let px = cx + i * a1x + j * a2x;
      let py = cy + i * a1y + j * a2y;
      if (jitterPx > 0) {
        px += jitterPx * rng.normal();
        py += jitterPx * rng.normal();
      }
      if (px < -reach || py < -reach || px > width + reach || py > height + reach) continue;
      const x0 = Math.max(0, Math.floor(px - reach));
      const x1 = Math.min(width - 1, Math.ceil(px + reach));
      const y0 = Math.max(0, Math.floor(py - reach));
      const y1 = Math.min(height - 1, Math.ceil(py + reach));
      for (let y = y0; y <= y1; y++) {
        const dy2 = (y - py) * (y - py);
        const row = y * width;
        for (let x = x0; x <= x1; x++) data[row + x] += Math.exp(-((x - px) * (x - px) + dy2) * inv2s2);
      }
    }
  }
  addNoiseAndClamp(data, noise, rng.normal);
  return { width, height, data };
}
