import type { GreyImage } from "../imaging/grey-image";
import { resolveReadoutSettings, type ReadoutOptions } from "./options";
import { computePowerSpectrum } from "./power-spectrum";
import { prepareRegion } from "./prepare-region";
import { applyWindow } from "./window";

/** Scales finite values linearly to 0..1 between the given percentiles (robust contrast). */
function stretch(data: Float32Array, lowPct: number, highPct: number): Float32Array {
  const sorted = Float32Array.from(data.filter((_, i) => i % Math.max(1, Math.floor(data.length / 65536)) === 0)).sort();
  const lo = sorted[Math.floor(lowPct * (sorted.length - 1))];
  const hi = sorted[Math.floor(highPct * (sorted.length - 1))];
  const span = hi - lo || 1;
  return data.map((v) => Math.min(1, Math.max(0, (v - lo) / span)));
}

/**
 * log(1 + |F|²) of the analysed region, zero frequency at the centre (fftshift), 0..1 for
 * encodePng. Size = the padded transform (powers of two).
 */
export function renderFftMagnitude(image: GreyImage, options: ReadoutOptions): GreyImage {
  const settings = resolveReadoutSettings(options, image.width, image.height);
  const region = prepareRegion(image, settings);
  applyWindow(region.data, region.width, region.height, settings.window, settings.tukeyAlpha);
  const s = computePowerSpectrum(region.data, region.width, region.height);
  const W = s.padWidth, H = s.padHeight;
  const out = new Float32Array(W * H);
  let peak = 0;
  for (const p of s.power) if (p > peak) peak = p;
  const norm = peak > 0 ? 1e6 / peak : 1; // show six decades below the peak
  for (let ky = 0; ky < H; ky++) {
    for (let kx = 0; kx < s.halfWidth; kx++) {
      const v = Math.log10(1 + s.power[ky * s.halfWidth + kx] * norm);
      const y = (ky + H / 2) % H;
      out[y * W + ((kx + W / 2) % W)] = v;
      // Hermitian mirror (−kx, −ky)
      out[((H - ky + H / 2) % H) * W + ((W - kx + W / 2) % W)] = v;
    }
  }
  out[(H / 2) * W + W / 2] = 0; // the removed mean
  return { width: W, height: H, data: stretch(out, 0, 1) };
}

/** The analysed region after ROI, inversion and flattening (before the window), stretched 0.5–99.5 %. */
export function renderPreview(image: GreyImage, options: ReadoutOptions): GreyImage {
  const settings = resolveReadoutSettings(options, image.width, image.height);
  const region = prepareRegion(image, settings);
  return { width: region.width, height: region.height, data: stretch(region.data, 0.005, 0.995) };
}
