import { nextPowerOfTwo, realPowerSpectrum2d, type SpectrumPrecision } from "../fft";
import { makeWindow1d, type WindowKind } from "./window";

/** |F|² of a prepared (flattened, windowed) region, zero-padded to powers of two; half plane kx ≥ 0. */
export interface PowerSpectrum {
  /** Transform size (power of two ≥ the region size). */
  padWidth: number;
  padHeight: number;
  /** Stored columns padWidth/2 + 1. */
  halfWidth: number;
  /** Row-major `padHeight × halfWidth`. */
  power: Float32Array;
  /** Ring width is 1/ringN cycles/px: ringN = the shorter unpadded side (the coarsest resolution). */
  ringN: number;
}

/** The window to multiply in as the FFT reads the rows (`data` itself is left as it is). */
export interface SpectrumWindow {
  window: WindowKind;
  tukeyAlpha?: number;
  precision?: SpectrumPrecision;
  /** The caller keeps nothing of the spectrum after its own synchronous call: |F|² may be a reused array. */
  reusePower?: boolean;
}

/**
 * |F|² of `data` (flattened, mean-free), windowed on the fly when `window` is given, so the caller
 * keeps its unwindowed pixels without a copy (sub-regions read them again).
 */
export function computePowerSpectrum(
  data: Float32Array,
  width: number,
  height: number,
  window?: SpectrumWindow,
): PowerSpectrum {
  const padWidth = nextPowerOfTwo(width);
  const padHeight = nextPowerOfTwo(height);
  const taper = window && window.window !== "none";
  const half = realPowerSpectrum2d(data, width, height, padWidth, padHeight, {
    windowX: taper ? makeWindow1d(window.window, width, window.tukeyAlpha) : undefined,
    windowY: taper ? makeWindow1d(window.window, height, window.tukeyAlpha) : undefined,
    precision: window?.precision,
    reusePower: window?.reusePower,
  });
  return { padWidth, padHeight, halfWidth: half.halfWidth, power: half.power, ringN: Math.min(width, height) };
}

/** Signed frequency (cycles/px) of row ky of a transform of height padHeight. */
export function rowFrequency(ky: number, padHeight: number): number {
  return (ky <= padHeight / 2 ? ky : ky - padHeight) / padHeight;
}

/** Hermitian multiplicity of a stored column: columns 0 and W/2 are their own mirror. */
export function columnWeight(kx: number, padWidth: number): number {
  return kx === 0 || kx === padWidth / 2 ? 1 : 2;
}

/**
 * Power at an integer bin (kx, ky) of the full plane, kx may be negative: uses
 * P(−kx, −ky) = P(kx, ky) for a real image.
 */
export function powerAt(s: PowerSpectrum, kx: number, ky: number): number {
  let x = kx,
    y = ky;
  if (x < 0) {
    x = -x;
    y = -y;
  }
  y = ((y % s.padHeight) + s.padHeight) % s.padHeight;
  if (x > s.padWidth / 2) x = s.padWidth - x; // only reachable at the Nyquist edge
  return s.power[y * s.halfWidth + x];
}

/**
 * Rows (as signed ky) and columns kx whose bins can lie within `maxRing` rings of the origin: the
 * bounding box of the annulus, so ring-restricted loops skip most of a large spectrum.
 */
export function annulusBox(s: PowerSpectrum, maxRing: number): { kyMax: number; kxMax: number } {
  const f = (maxRing + 1) / s.ringN;
  return {
    kyMax: Math.min(s.padHeight / 2, Math.ceil(f * s.padHeight)),
    kxMax: Math.min(s.halfWidth - 1, Math.ceil(f * s.padWidth)),
  };
}
