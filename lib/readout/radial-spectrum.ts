import { columnWeight, rowFrequency, type PowerSpectrum } from "./power-spectrum";

/** Ring-averaged power: ring r holds |f| in [(r − ½)/N, (r + ½)/N) cycles/px, N = ringN. */
export interface RadialSpectrum {
  /** Ring centres (cycles/px), r/N for r = 0 … N/2. */
  frequencyPerPx: Float64Array;
  /** Mean power in each ring (arbitrary units). */
  power: Float64Array;
  /** Number of full-plane bins in each ring. */
  count: Float64Array;
}

export function computeRadialSpectrum(s: PowerSpectrum): RadialSpectrum {
  const rings = Math.floor(s.ringN / 2) + 1;
  const sum = new Float64Array(rings);
  const count = new Float64Array(rings);
  const n2 = s.ringN * s.ringN;
  const fx2 = new Float64Array(s.halfWidth);
  const weight = new Float64Array(s.halfWidth);
  for (let kx = 0; kx < s.halfWidth; kx++) {
    fx2[kx] = (kx / s.padWidth) ** 2 * n2; // in ring units²
    weight[kx] = columnWeight(kx, s.padWidth);
  }
  for (let ky = 0; ky < s.padHeight; ky++) {
    const fy2 = rowFrequency(ky, s.padHeight) ** 2 * n2;
    if (fy2 > (rings - 0.5) ** 2) continue;
    const row = ky * s.halfWidth;
    for (let kx = 0; kx < s.halfWidth; kx++) {
      const r = (Math.sqrt(fx2[kx] + fy2) + 0.5) | 0;
      if (r >= rings) break; // fx grows along the row
      const w = weight[kx];
      sum[r] += w * s.power[row + kx];
      count[r] += w;
    }
  }
  const power = new Float64Array(rings);
  const frequencyPerPx = new Float64Array(rings);
  for (let r = 0; r < rings; r++) {
    power[r] = count[r] > 0 ? sum[r] / count[r] : 0;
    frequencyPerPx[r] = r / s.ringN;
  }
  return { frequencyPerPx, power, count };
}
