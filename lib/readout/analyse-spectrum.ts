import { computeAngularStats, classifySymmetry, type AngularStats, type PatternSymmetry } from "./angular";
import {
  evaluatePowerLaw,
  fitPowerLaw,
  localLogQuadraticAt,
  ringLogs,
  type PowerLaw,
  type RingLogs,
} from "./background-fit";
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

/** True when ring r is a local maximum of the radial spectrum. */
function isLocalMaximum(radial: RadialSpectrum, r: number): boolean {
  const p = radial.power;
  return r > 0 && r + 1 < p.length && p[r] > p[r - 1] && p[r] >= p[r + 1];
}

/**
 * The background under ring r: a power law fitted over rings [r/2, 2r] (one octave either side)
 * leaving out r ± max(3, r/4), where the peak and its shoulders lie. Local, so a background that
 * is not one power law over the whole spectrum (a residual illumination at low frequencies, a
 * blur roll-off at high ones) does not lift noise to a "peak".
 */
function localBackground(
  radial: RadialSpectrum,
  logs: RingLogs,
  r: number,
  fitFrom: number,
  last: number,
  global: PowerLaw,
): number {
  const ex = Math.max(3, Math.ceil(r / 4));
  // An octave either side, but at least 8 rings beyond the left-out band on each side.
  const from = Math.max(fitFrom, Math.min(Math.floor(r / 2), r - ex - 8)),
    to = Math.min(last, Math.max(Math.ceil(2 * r), r + ex + 8));
  if (r - ex - from < 4 || to - (r + ex) < 4) return evaluatePowerLaw(global, radial.frequencyPerPx[r]);
  const bent = localLogQuadraticAt(logs, from, to, r - ex, r + ex, r);
  return Number.isFinite(bent) ? bent : evaluatePowerLaw(global, radial.frequencyPerPx[r]);
}

/**
 * Finds and measures the dominant ring of a power spectrum. `searchRings` restricts the search
 * (used on sub-regions and tiles, which look near the whole region's peak).
 */
export function analyseSpectrum(
  s: PowerSpectrum,
  lowCutRings: number,
  searchRings?: [number, number],
): SpectrumAnalysis {
  const radial = computeRadialSpectrum(s);
  const last = radial.power.length - 1;
  const fitFrom = Math.max(1, Math.ceil(lowCutRings));
  const searchFrom = Math.max(fitFrom, Math.ceil(searchRings?.[0] ?? fitFrom));
  // A period shorter than 3 px is not resolved (Nyquist is 2 px), and a peak needs rings above it for its background.
  const searchTo = Math.min(last - 4, Math.floor(s.ringN / 3), Math.floor(searchRings?.[1] ?? last - 1));
  // The peak: the local maximum of the radial spectrum that stands highest above a background
  // fitted around it without it (a slope of the background is never a peak).
  const global = fitPowerLaw(radial.frequencyPerPx, radial.power, fitFrom, last, -1, -1);
  const logs = ringLogs(radial.frequencyPerPx, radial.power);
  const peakRing = findPeakRing(radial, searchFrom, Math.max(searchFrom, searchTo), (r) =>
    localBackground(radial, logs, r, fitFrom, last, global),
  );
  // The background of the whole spectrum without the peak, for its width, the angular statistics and the plot.
  let bg = fitPowerLaw(radial.frequencyPerPx, radial.power, fitFrom, last, peakRing - 3, peakRing + 3);
  let halfWidthRings = peakHalfWidthRings(radial, peakRing, bg, last);
  const ex = Math.max(3, Math.ceil(2.5 * halfWidthRings));
  bg = fitPowerLaw(radial.frequencyPerPx, radial.power, fitFrom, last, peakRing - ex, peakRing + ex);
  halfWidthRings = peakHalfWidthRings(radial, peakRing, bg, last);
  const refinedRing = refineRing(radial, peakRing);
  const band = Math.max(1, Math.min(halfWidthRings, 0.15 * peakRing));
  const angular = computeAngularStats(s, peakRing - band, peakRing + band, bg);
  const symmetry = classifySymmetry(angular);
  const peak2d = refinePeak2d(s, peakRing - 1, peakRing + 1);
  const fRing = refinedRing / s.ringN;
  const f2d = peak2d ? Math.hypot(peak2d.fx, peak2d.fy) : fRing;
  const frequencyPerPx = symmetry === "labyrinth" ? fRing : f2d;
  const local = localBackground(radial, logs, peakRing, fitFrom, last, bg);
  const significance = isLocalMaximum(radial, peakRing) ? radial.power[peakRing] / local : 0;
  return {
    radial,
    background: bg,
    peakRing,
    refinedRing,
    halfWidthRings,
    peak2d,
    frequencyPerPx,
    significance,
    angular,
    symmetry,
    searchFrom,
    searchTo,
  };
}
