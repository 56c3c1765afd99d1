import type { ResolvedReadoutOptions } from "./options";
import type { PreparedRegion } from "./prepare-region";
import { measureTile } from "./measure-tile";

/** Largest sub-region side (px); keeps nine sub-region FFTs cheaper than the whole-region FFT. */
export const MAX_SUBREGION_SIDE_PX = 512;
/** A sub-region must hold this many periods along each side. */
export const MIN_PERIODS_PER_SUBREGION = 4;

export interface SubregionSpread {
  /** λ of each usable sub-region (px of the analysed grid). */
  wavelengthsPx: number[];
  /** Centre of each usable sub-region (px of the analysed grid), in the order of wavelengthsPx. */
  centresPx: Array<[number, number]>;
  /** SD(λᵢ)/√n_eff (px), n_eff = min(n, region area ÷ sub-region area); null with fewer than 3 usable sub-regions. */
  semPx: number | null;
  sidePx: [number, number];
}

/**
 * λ over a 3 × 3 grid of sub-regions, each half the region's side (capped at 512 px) and
 * overlapping their neighbours by half (offsets 0, ½, 1 of the free range).
 * Overlap makes the λᵢ positively correlated, so n in SD/√n is the number of sub-regions that
 * fit side by side (4 for half-size sub-regions), not 9.
 */
export function measureSubregionSpread(
  region: PreparedRegion,
  settings: ResolvedReadoutOptions,
  frequencyPerPx: number,
): SubregionSpread {
  const sw = Math.min(Math.floor(region.width / 2), MAX_SUBREGION_SIDE_PX);
  const sh = Math.min(Math.floor(region.height / 2), MAX_SUBREGION_SIDE_PX);
  const lambda = 1 / frequencyPerPx;
  const out: SubregionSpread = { wavelengthsPx: [], centresPx: [], semPx: null, sidePx: [sw, sh] };
  if (sw < MIN_PERIODS_PER_SUBREGION * lambda || sh < MIN_PERIODS_PER_SUBREGION * lambda || sw < 16 || sh < 16)
    return out;
  for (const fy of [0, 0.5, 1]) {
    for (const fx of [0, 0.5, 1]) {
      const x = Math.round(fx * (region.width - sw));
      const y = Math.round(fy * (region.height - sh));
      const m = measureTile(region, x, y, sw, sh, settings, frequencyPerPx, 0.3);
      if (m) {
        out.wavelengthsPx.push(1 / m.frequencyPerPx);
        out.centresPx.push([x + sw / 2, y + sh / 2]);
      }
    }
  }
  const n = out.wavelengthsPx.length;
  if (n >= 3) {
    const mean = out.wavelengthsPx.reduce((s, v) => s + v, 0) / n;
    const sd = Math.sqrt(out.wavelengthsPx.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1));
    // Overlapping sub-regions are not independent: count at most as many as fit side by side.
    const independent = Math.max(1, Math.min(n, Math.floor((region.width * region.height) / (sw * sh))));
    out.semPx = sd / Math.sqrt(independent);
  }
  return out;
}
