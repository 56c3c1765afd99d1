import { inverseRealFft2d, nextPowerOfTwo, type HalfSpectrum } from "../fft";
import type { PatternSymmetry } from "./angular";
import { powerAt, type PowerSpectrum } from "./power-spectrum";

/** First maximum of J₀ after the origin: J₁(x) = 0 at x = 7.0156 (Abramowitz & Stegun 1964, Table 9.5). */
const J0_FIRST_MAX = 7.015586669815619;

export interface AutocorrelationCheck {
  /** Lag of the first off-origin maximum (px of the analysed grid). */
  firstMaximumPx: number;
  /** The Fourier wavelength that lag implies for the symmetry (px). */
  impliedWavelengthPx: number;
  /** Lag-grid spacing of the band-limited autocorrelation (px). */
  lagStepPx: number;
  /** How the lag was read: along the wave vector, along a lattice vector, or averaged over angles. */
  direction: "wave-vector" | "lattice-vector" | "angular-average";
}

/**
 * Autocorrelation by Wiener–Khinchin: C = F⁻¹(|F|²). Only frequencies up to ~4× the peak are kept
 * (with a radial Hann taper), which gives a smooth C on a coarser lag grid at a fraction of the
 * full inverse FFT's cost. The first off-origin maximum lies at λ along the wave vector (stripes),
 * at a = (2/√3)λ along a lattice vector (hexagonal spots: geometry), and for an isotropic ring the
 * angular average is J₀(2πr/λ), first maximum at r = 7.0156λ/(2π) ≈ 1.117λ.
 */
export function computeAutocorrelationCheck(
  s: PowerSpectrum,
  frequencyPerPx: number,
  symmetry: PatternSymmetry,
  orientationDeg: number,
  orientation6Deg: number,
): AutocorrelationCheck | null {
  const mx = Math.min(s.padWidth / 2, Math.max(8, nextPowerOfTwo(Math.ceil(4 * frequencyPerPx * s.padWidth))));
  const my = Math.min(s.padHeight / 2, Math.max(8, nextPowerOfTwo(Math.ceil(4 * frequencyPerPx * s.padHeight))));
  const width = 2 * mx,
    height = 2 * my,
    halfWidth = mx + 1;
  const data = new Float64Array(2 * halfWidth * height);
  for (let ky = -my; ky < my; ky++) {
    const row = ((ky + height) % height) * halfWidth;
    for (let kx = 0; kx <= mx; kx++) {
      const rho = Math.min(1, Math.hypot(kx / mx, ky / my));
      data[2 * (row + kx)] = powerAt(s, kx, ky) * 0.5 * (1 + Math.cos(Math.PI * rho));
    }
  }
  const half: HalfSpectrum = { width, height, halfWidth, data };
  const c = inverseRealFft2d(half);
  const sx = s.padWidth / width,
    sy = s.padHeight / height; // px of lag per grid step
  const sample = (lx: number, ly: number): number => {
    const gx = lx / sx,
      gy = ly / sy;
    const x0 = Math.floor(gx),
      y0 = Math.floor(gy),
      tx = gx - x0,
      ty = gy - y0;
    const at = (x: number, y: number) =>
      c[(((y % height) + height) % height) * width + (((x % width) + width) % width)];
    return (
      (1 - ty) * ((1 - tx) * at(x0, y0) + tx * at(x0 + 1, y0)) +
      ty * ((1 - tx) * at(x0, y0 + 1) + tx * at(x0 + 1, y0 + 1))
    );
  };
  const lambda = 1 / frequencyPerPx;
  let direction: AutocorrelationCheck["direction"] = "angular-average";
  let angles: number[] = [];
  if (symmetry === "stripes") {
    direction = "wave-vector";
    angles = [orientationDeg];
  } else if (symmetry === "hexagonal") {
    direction = "lattice-vector";
    angles = [0, 60, 120].map((d) => orientation6Deg + 30 + d);
  } else for (let d = 0; d < 180; d += 5) angles.push(d);
  const dr = lambda / 50;
  const steps = Math.ceil((2.5 * lambda) / dr);
  const profile = new Float64Array(steps + 1);
  for (let k = 0; k <= steps; k++) {
    let sum = 0;
    for (const deg of angles) {
      const t = (deg * Math.PI) / 180;
      sum += sample(k * dr * Math.cos(t), k * dr * Math.sin(t));
    }
    profile[k] = sum / angles.length;
  }
  let k = 1;
  while (k < steps && profile[k] <= profile[k - 1]) k++; // walk down from the origin to the first minimum
  while (k < steps && profile[k + 1] > profile[k]) k++; // then up to the first maximum
  if (k >= steps || k < 2) return null;
  const den = profile[k - 1] - 2 * profile[k] + profile[k + 1];
  const offset = den < 0 ? (0.5 * (profile[k - 1] - profile[k + 1])) / den : 0;
  const firstMaximumPx = (k + offset) * dr;
  const factor =
    symmetry === "stripes" ? 1 : symmetry === "hexagonal" ? Math.sqrt(3) / 2 : (2 * Math.PI) / J0_FIRST_MAX;
  return { firstMaximumPx, impliedWavelengthPx: firstMaximumPx * factor, lagStepPx: Math.max(sx, sy), direction };
}
