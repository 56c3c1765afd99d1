import { analyseSpectrum } from "./analyse-spectrum";
import { subtractMean } from "./flatten";
import type { ResolvedReadoutOptions } from "./options";
import { computePowerSpectrum } from "./power-spectrum";
import type { PreparedRegion } from "./prepare-region";
import { applyWindow } from "./window";

/** A readout of one rectangle of a prepared region, searched near a known frequency. */
export interface TileMeasurement {
  frequencyPerPx: number;
  significance: number;
}

/**
 * Measures the peak frequency of the sub-rectangle (x, y, w, h) of `region`, searching rings within
 * ±`band` (fraction) of `nearFrequencyPerPx`. Returns null when fewer than half its pixels are
 * included or the peak is below the significance threshold.
 */
export function measureTile(
  region: PreparedRegion,
  x: number,
  y: number,
  w: number,
  h: number,
  settings: ResolvedReadoutOptions,
  nearFrequencyPerPx: number,
  band: number,
): TileMeasurement | null {
  const data = new Float32Array(w * h);
  const inc = region.included ? new Uint8Array(w * h) : null;
  let count = 0;
  for (let row = 0; row < h; row++) {
    const src = (row + y) * region.width + x;
    data.set(region.data.subarray(src, src + w), row * w);
    if (inc && region.included) {
      inc.set(region.included.subarray(src, src + w), row * w);
      for (let k = 0; k < w; k++) count += inc[row * w + k];
    }
  }
  if (inc && 2 * count < w * h) return null;
  if (!(subtractMean(data, inc) > 0)) return null;
  applyWindow(data, w, h, settings.window, settings.tukeyAlpha);
  const spec = computePowerSpectrum(data, w, h);
  const ring = nearFrequencyPerPx * spec.ringN;
  const a = analyseSpectrum(spec, settings.lowCutCycles, [ring * (1 - band), ring * (1 + band)]);
  if (!(a.significance >= settings.significanceThreshold)) return null;
  return { frequencyPerPx: a.frequencyPerPx, significance: a.significance };
}
