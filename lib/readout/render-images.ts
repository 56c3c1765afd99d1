import type { GreyImage } from "../imaging/grey-image";
import { resolveReadoutOptions, type ReadoutOptions } from "./options";
import { applyMaskTaper } from "./mask-taper";
import { computePowerSpectrum } from "./power-spectrum";
import { prepareRegion } from "./prepare-region";
import { applyWindow } from "./window";

/** Scales finite values linearly to 0..1 between the given percentiles (robust contrast). */
function stretch(data: Float32Array, lowPct: number, highPct: number): Float32Array {
  const sorted = Float32Array.from(
    data.filter((_, i) => i % Math.max(1, Math.floor(data.length / 65536)) === 0),
  ).sort();
  const lo = sorted[Math.floor(lowPct * (sorted.length - 1))];
  const hi = sorted[Math.floor(highPct * (sorted.length - 1))];
  const span = hi - lo || 1;
  return data.map((v) => Math.min(1, Math.max(0, (v - lo) / span)));
}

/** The Fourier image and where its frequencies lie, for drawing the peak ring over it. */
export interface FftImage {
  image: GreyImage;
  /** Frequency at the image's edge, cycles/µm (the image spans ± this on both axes). */
  maxFrequencyPerUm: number;
  /** The peak's radius as a fraction of the half-width (null without a peak). */
  ringFraction: number | null;
}

/**
 * log(1 + |F|²) of the analysed region, zero frequency at the centre (fftshift), 0..1 for
 * encodePng. With a peak (`peakWavelengthPx`, source pixels) the image is cropped to ± 3 × the
 * peak frequency (at least ± 16 bins), where the pattern's ring and its harmonics lie; the
 * rest is only noise and would hide the ring.
 */
export function renderFftMagnitude(
  image: GreyImage,
  options: ReadoutOptions,
  peakWavelengthPx: number | null = null,
): FftImage {
  const settings = resolveReadoutOptions(options, image.width, image.height);
  const region = prepareRegion(image, settings);
  if (region.tissueMask && region.included && settings.window !== "none")
    applyMaskTaper(region.data, region.width, region.height, region.included);
  else applyWindow(region.data, region.width, region.height, settings.window, settings.tukeyAlpha);
  const s = computePowerSpectrum(region.data, region.width, region.height);
  const W = s.padWidth,
    H = s.padHeight;
  const full = new Float32Array(W * H);
  let peak = 0;
  for (const p of s.power) if (p > peak) peak = p;
  const norm = peak > 0 ? 1e6 / peak : 1; // show six decades below the peak
  for (let ky = 0; ky < H; ky++) {
    for (let kx = 0; kx < s.halfWidth; kx++) {
      const v = Math.log10(1 + s.power[ky * s.halfWidth + kx] * norm);
      const y = (ky + H / 2) % H;
      full[y * W + ((kx + W / 2) % W)] = v;
      // Hermitian mirror (−kx, −ky)
      full[((H - ky + H / 2) % H) * W + ((W - kx + W / 2) % W)] = v;
    }
  }
  full[(H / 2) * W + W / 2] = 0; // the removed mean
  // Frequencies in cycles per analysed pixel; the peak's from the source-pixel wavelength.
  const fPeak = peakWavelengthPx !== null && peakWavelengthPx > 0 ? region.binFactor / peakWavelengthPx : null;
  const fMax = fPeak === null ? 0.5 : Math.min(0.5, Math.max(3 * fPeak, 16 / Math.min(W, H)));
  const bx = Math.min(W / 2, Math.round(fMax * W)),
    by = Math.min(H / 2, Math.round(fMax * H));
  const out = new Float32Array(4 * bx * by);
  for (let y = 0; y < 2 * by; y++)
    out.set(full.subarray((H / 2 - by + y) * W + W / 2 - bx, (H / 2 - by + y) * W + W / 2 + bx), y * 2 * bx);
  const edge = bx / W; // cycles per analysed pixel at the image's left/right edge
  return {
    image: { width: 2 * bx, height: 2 * by, data: stretch(out, 0, 1) },
    maxFrequencyPerUm: edge / region.pixelSizeUm,
    ringFraction: fPeak === null ? null : fPeak / edge,
  };
}

/** The analysed region after ROI, inversion and flattening (before the window), stretched 0.5–99.5 %. */
export function renderPreview(image: GreyImage, options: ReadoutOptions): GreyImage {
  const settings = resolveReadoutOptions(options, image.width, image.height);
  const region = prepareRegion(image, settings);
  return { width: region.width, height: region.height, data: stretch(region.data, 0.005, 0.995) };
}
