import { computeAngularStats, classifySymmetry, type AngularStats, type PatternSymmetry } from "./angular";
import { evaluatePowerLaw, fitPowerLaw, type PowerLaw } from "./background-fit";
import { findPeakRing, peakHalfWidthRings, refinePeak2d, refineRing, type Peak2d } from "./peak";
import type { PowerSpectrum } from "./power-spectrum";
import { computeRadialSpectrum, type RadialSpectrum } from "./radial-spectrum";

export interface SpectrumAnalysis {
  radial: RadialSpectrum;
  background: PowerLaw;
  /** Integer ring of the peak and its log-parabola refinement (rings of width 1/ringN). */
  peakRing: number;
  refinedRing: number;
  halfWidthRings: number;
  peak2d: Peak2d | null;
  /** Spatial frequency of the peak (cycles/px): 2-D refined for stripes and spots, ring-refined for labyrinths. */
  frequencyPerPx: number;
  /** Peak ring power ÷ fitted background at that frequency. */
  significance: number;
  angular: AngularStats;
  symmetry: PatternSymmetry;
  /** Rings that were searched. */
  searchFrom: number;
  searchTo: number;
}

/**
 * Finds and measures the dominant ring of a power spectrum. `searchRings` restricts the search
 * (used on sub-regions and tiles, which look near the whole region's peak).
 */
export function analyseSpectrum(s: PowerSpectrum, lowCutRings: number, searchRings?: [number, number]): SpectrumAnalysis {
  const radial = computeRadialSpectrum(s);
  const last = radial.power.length - 1;
  const fitFrom = Math.max(1, Math.ceil(lowCutRings));
  const searchFrom = Math.max(fitFrom, Math.ceil(searchRings?.[0] ?? fitFrom));
  const searchTo = Math.min(last - 1, Math.floor(searchRings?.[1] ?? last - 1));
  // Fit, pick the most prominent ring, refit without it, pick again (two passes suffice in practice).
  let bg = fitPowerLaw(radial.frequencyPerPx, radial.power, fitFrom, last, -1, -1);
  let peakRing = findPeakRing(radial, searchFrom, Math.max(searchFrom, searchTo), bg);
  let halfWidthRings = 1;
  for (let pass = 0; pass < 2; pass++) {
    const ex = Math.max(3, Math.ceil(2.5 * halfWidthRings));
    bg = fitPowerLaw(radial.frequencyPerPx, radial.power, fitFrom, last, peakRing - ex, peakRing + ex);
    peakRing = findPeakRing(radial, searchFrom, Math.max(searchFrom, searchTo), bg);
    halfWidthRings = peakHalfWidthRings(radial, peakRing, bg, last);
  }
  const refinedRing = refineRing(radial, peakRing);
  const band = Math.max(1, Math.min(halfWidthRings, 0.15 * peakRing));
  const angular = computeAngularStats(s, peakRing - band, peakRing + band, bg);
  const symmetry = classifySymmetry(angular);
  const peak2d = refinePeak2d(s, peakRing - 1, peakRing + 1);
  const fRing = refinedRing / s.ringN;
  const f2d = peak2d ? Math.hypot(peak2d.fx, peak2d.fy) : fRing;
  const frequencyPerPx = symmetry === "labyrinth" ? fRing : f2d;
  const significance = radial.power[peakRing] / evaluatePowerLaw(bg, radial.frequencyPerPx[peakRing]);
  return { radial, background: bg, peakRing, refinedRing, halfWidthRings, peak2d, frequencyPerPx, significance, angular, symmetry, searchFrom, searchTo };
}
