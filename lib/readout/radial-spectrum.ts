import { currentSpectrumExecutor, MIN_PARALLEL_BINS } from "../fft";
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
  // In shared memory, so a second thread reads it in place (computeRadialSpectrum).
  const cells = rowsHalf * hw;
  const ring =
    rings < 0xffff
      ? new Uint16Array(new SharedArrayBuffer(2 * cells))
      : new Uint32Array(new SharedArrayBuffer(4 * cells));
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

/**
 * The ring averages. The sums are taken over the rows in two fixed halves, [0, H/2) and [H/2, H),
 * then added: with a second thread (SpectrumExecutor.splitRows, |F|² in shared memory) each half is
 * summed on its own thread, and on one thread the same two halves in the same order, so the numbers
 * are the same either way.
 */
export function computeRadialSpectrum(s: PowerSpectrum): RadialSpectrum {
  const { rings, ring, count } = ringTable(s);
  const H = s.padHeight,
    split = H >> 1;
  const executor = currentSpectrumExecutor();
  const parallel =
    executor?.splitRows && s.power.buffer instanceof SharedArrayBuffer && s.power.length >= MIN_PARALLEL_BINS;
  const job: RadialRowsJob = {
    power: s.power,
    ring,
    halfWidth: s.halfWidth,
    height: H,
    split,
    // the last slot of each half collects bins beyond the last ring
    sums: parallel ? new Float64Array(new SharedArrayBuffer(16 * (rings + 1))) : new Float64Array(2 * (rings + 1)),
  };
  const both = parallel ? executor.splitRows!("radial-rows", job, split, H, () => runRadialRows(job, 0, split)) : null;
  if (both === null) {
    runRadialRows(job, 0, split);
    runRadialRows(job, split, H);
  }
  const power = new Float64Array(rings);
  const frequencyPerPx = new Float64Array(rings);
  for (let r = 0; r < rings; r++) {
    const sum = job.sums[r] + job.sums[rings + 1 + r];
    power[r] = count[r] > 0 ? sum / count[r] : 0;
    frequencyPerPx[r] = r / s.ringN;
  }
  return { frequencyPerPx, power, count: count.slice(0, rings) };
}

/** The radial average's pass over |F|² as a row kernel (SpectrumExecutor.splitRows). */
export interface RadialRowsJob {
  power: Float32Array;
  /** The ring table (in shared memory: the other thread reads it in place). */
  ring: Uint16Array | Uint32Array;
  halfWidth: number;
  height: number;
  /** Rows before `split` add into the first half of `sums`, the others into the second. */
  split: number;
  sums: Float64Array;
}

/** Rows [from, to) of the radial average, all on one side of the job's split. */
export function runRadialRows(job: RadialRowsJob, from: number, to: number): boolean {
  const { power: P, ring, halfWidth: hw, height: H } = job;
  const part = job.sums.length >> 1;
  const sum = job.sums.subarray(from < job.split ? 0 : part, from < job.split ? part : 2 * part);
  for (let ky = from; ky < to; ky++) {
    const t = (ky <= H / 2 ? ky : H - ky) * hw,
      row = ky * hw;
    sum[ring[t]] += P[row]; // column 0 and column W/2 are their own mirror: weight 1
    for (let kx = 1; kx < hw - 1; kx++) sum[ring[t + kx]] += 2 * P[row + kx];
    sum[ring[t + hw - 1]] += P[row + hw - 1];
  }
  return true;
}
