import { rowFrequency, type PowerSpectrum } from "./power-spectrum";

/** Ring-averaged power: ring r holds |f| in [(r − ½)/N, (r + ½)/N) cycles/px, N = ringN. */
export interface RadialSpectrum {
  /** Ring centres (cycles/px), r/N for r = 0 … N/2. */
  frequencyPerPx: Float64Array;
  /** Mean power in each ring (arbitrary units). */
  power: Float64Array;
  /** Number of full-plane bins in each ring. */
  count: Float64Array;
}

/**
 * Which ring each stored bin falls in, for rows |ky| = 0 … H/2 (row ky and row H − ky share it),
 * and the full-plane bin count of each ring. It depends only on the geometry, so it is built once
 * per (padWidth, padHeight, ringN) and the radial average is then one branch-free pass over |F|².
 */
interface RingTable {
  rings: number;
  /** (H/2 + 1) × halfWidth ring indices; `rings` marks a bin beyond the last ring. */
  ring: Uint16Array | Uint32Array;
  count: Float64Array;
}

const tables = new Map<string, RingTable>();
/** A few geometries are in use at once (the region, its sub-regions, tiles); keep the latest. */
const MAX_TABLES = 4;

function ringTable(s: PowerSpectrum): RingTable {
  const key = `${s.padWidth}×${s.padHeight}/${s.ringN}`;
  const hit = tables.get(key);
  if (hit) return hit;
  const rings = Math.floor(s.ringN / 2) + 1;
  const n2 = s.ringN * s.ringN;
  const hw = s.halfWidth,
    rowsHalf = s.padHeight / 2 + 1;
  const ring = rings < 0xffff ? new Uint16Array(rowsHalf * hw) : new Uint32Array(rowsHalf * hw);
  const fx2 = new Float64Array(hw);
  for (let kx = 0; kx < hw; kx++) fx2[kx] = (kx / s.padWidth) ** 2 * n2; // in ring units²
  for (let ky = 0; ky < rowsHalf; ky++) {
    const fy2 = rowFrequency(ky, s.padHeight) ** 2 * n2;
    for (let kx = 0; kx < hw; kx++) ring[ky * hw + kx] = Math.min(rings, (Math.sqrt(fx2[kx] + fy2) + 0.5) | 0);
  }
  // Counts over the full plane: every row ky of the transform, columns 0 and W/2 once, the others twice.
  const count = new Float64Array(rings + 1);
  for (let ky = 0; ky < s.padHeight; ky++) {
    const t = Math.min(ky, s.padHeight - ky) * hw;
    for (let kx = 0; kx < hw; kx++) count[ring[t + kx]] += kx === 0 || kx === hw - 1 ? 1 : 2;
  }
  const table = { rings, ring, count };
  if (tables.size >= MAX_TABLES) tables.delete(tables.keys().next().value!);
  tables.set(key, table);
  return table;
}

export function computeRadialSpectrum(s: PowerSpectrum): RadialSpectrum {
  const { rings, ring, count } = ringTable(s);
  const sum = new Float64Array(rings + 1); // the last slot collects bins beyond the last ring
  const P = s.power,
    hw = s.halfWidth,
    H = s.padHeight;
  for (let ky = 0; ky < H; ky++) {
    const t = (ky <= H / 2 ? ky : H - ky) * hw,
      row = ky * hw;
    sum[ring[t]] += P[row]; // column 0 and column W/2 are their own mirror: weight 1
    for (let kx = 1; kx < hw - 1; kx++) sum[ring[t + kx]] += 2 * P[row + kx];
    sum[ring[t + hw - 1]] += P[row + hw - 1];
  }
  const power = new Float64Array(rings);
  const frequencyPerPx = new Float64Array(rings);
  for (let r = 0; r < rings; r++) {
    power[r] = count[r] > 0 ? sum[r] / count[r] : 0;
    frequencyPerPx[r] = r / s.ringN;
  }
  return { frequencyPerPx, power, count: count.slice(0, rings) };
}
