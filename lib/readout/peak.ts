import { evaluatePowerLaw, type PowerLaw } from "./background-fit";
import { annulusBox, powerAt, rowFrequency, type PowerSpectrum } from "./power-spectrum";
import type { RadialSpectrum } from "./radial-spectrum";

/** Vertex offset of the parabola through (−1, a), (0, b), (1, c), clamped to ±½ (three-point interpolation). */
export function parabolaOffset(a: number, b: number, c: number): number {
  const den = a - 2 * b + c;
  if (!(den < 0)) return 0;
  const d = (0.5 * (a - c)) / den;
  return Math.max(-0.5, Math.min(0.5, d));
}

const safeLog = (v: number) => Math.log(Math.max(v, 1e-300));

/**
 * Ring in [from, to] with the largest power relative to the background (or absolute, without one),
 * among the local maxima of the radial spectrum: a slope of the background is never a peak.
 * Falls back to `from` when no ring is a local maximum (the caller's significance then says no).
 */
export function findPeakRing(
  radial: RadialSpectrum,
  from: number,
  to: number,
  background: ((ring: number) => number) | null,
): number {
  let best = from,
    bestScore = -Infinity;
  const p = radial.power;
  for (let r = from; r <= to; r++) {
    if (radial.count[r] === 0) continue;
    if (!(p[r] > p[r - 1] && p[r] >= p[r + 1])) continue;
    const score = safeLog(radial.power[r]) - (background ? safeLog(background(r)) : 0);
    if (score > bestScore) {
      bestScore = score;
      best = r;
    }
  }
  return best;
}

/** Peak ring refined by a parabola on log power (fractional ring index). */
export function refineRing(radial: RadialSpectrum, r: number): number {
  if (r <= 0 || r + 1 >= radial.power.length) return r;
  return r + parabolaOffset(safeLog(radial.power[r - 1]), safeLog(radial.power[r]), safeLog(radial.power[r + 1]));
}

/**
 * Half width at half maximum of the peak above the background (rings), interpolated linearly on
 * each side; the mean of the two sides, or the one side found.
 */
export function peakHalfWidthRings(radial: RadialSpectrum, r: number, bg: PowerLaw, to: number): number {
  const excess = (k: number) => radial.power[k] - evaluatePowerLaw(bg, radial.frequencyPerPx[k]);
  const half = excess(r) / 2;
  const side = (dir: number): number | null => {
    for (let k = r + dir, prev = excess(r); k >= 1 && k <= to; k += dir) {
      const e = excess(k);
      if (e <= half) return Math.abs(k - r) - (half - e) / (prev - e || 1);
      prev = e;
    }
    return null;
  };
  const lo = side(-1),
    hi = side(1);
  const found = [lo, hi].filter((v): v is number => v !== null);
  return found.length ? Math.max(0.5, found.reduce((a, b) => a + b, 0) / found.length) : 0.5;
}

/** A refined 2-D peak: wave vector (cycles/px), fx ≥ 0, fy signed (rows down). */
export interface Peak2d {
  fx: number;
  fy: number;
  /** Power of the strongest bin (before refinement). */
  power: number;
}

/**
 * The strongest bin with ring index in [ringLo, ringHi], refined by a log-parabola along each
 * axis of the (padded) grid; the spectrum of a separable window is separable, so the two 1-D fits
 * locate the peak of a plane wave to a small fraction of a bin.
 */
export function refinePeak2d(s: PowerSpectrum, ringLo: number, ringHi: number): Peak2d | null {
  let bestKx = -1,
    bestKy = 0,
    best = -Infinity;
  const { kyMax, kxMax } = annulusBox(s, ringHi);
  for (let kys = -kyMax; kys <= kyMax; kys++) {
    const ky = (kys + s.padHeight) % s.padHeight;
    if (kys === s.padHeight / 2 && kyMax === s.padHeight / 2 && kys !== -kyMax) continue; // Nyquist row once
    const fy = rowFrequency(ky, s.padHeight);
    for (let kx = 0; kx <= kxMax; kx++) {
      const fx = kx / s.padWidth;
      const ring = Math.sqrt(fx * fx + fy * fy) * s.ringN;
      if (ring < ringLo || ring > ringHi) continue;
      const p = s.power[ky * s.halfWidth + kx];
      if (p > best) {
        best = p;
        bestKx = kx;
        bestKy = ky;
      }
    }
  }
  if (bestKx < 0) return null;
  const kyS = bestKy <= s.padHeight / 2 ? bestKy : bestKy - s.padHeight;
  const dx = parabolaOffset(safeLog(powerAt(s, bestKx - 1, kyS)), safeLog(best), safeLog(powerAt(s, bestKx + 1, kyS)));
  const dy = parabolaOffset(safeLog(powerAt(s, bestKx, kyS - 1)), safeLog(best), safeLog(powerAt(s, bestKx, kyS + 1)));
  return { fx: (bestKx + dx) / s.padWidth, fy: (kyS + dy) / s.padHeight, power: best };
}
