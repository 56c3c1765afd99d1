import { currentSpectrumExecutor, MIN_PARALLEL_BINS } from "../fft";
import { blur } from "./flatten";

/** Local texture and brightness of a region on a coarse grid of c × c px cells. */
export interface TextureMap {
  /** Cell side (px) and grid size. */
  cellPx: number;
  columns: number;
  rows: number;
  /** SD of the Gaussian window the statistics are taken in (cells). */
  windowCells: number;
  /** log of (pattern variance ÷ noise variance) in the window, floored at log(MIN_SNR). */
  logSnr: Float32Array;
  /** Local mean of the intensity before the Gaussian background is removed (the pattern averaged out). */
  brightness: Float32Array;
  /** Local SD of the band-passed image (pattern and noise): the scale a brightness step is judged against. */
  sd: Float32Array;
  /** 1 where at least half the cell is analysed. */
  use: Uint8Array;
}

/** Texture-to-noise ratios below this are noise (a floor for the logarithm). */
export const MIN_SNR = 0.05;
/** Light smoothing (px) against pixel noise before the local variance. */
const SMOOTH_SIGMA_PX = 1.5;

let gains: { smoothGain: number; fineGain: number } | null = null;
/** Σg² and Σ(δ − g)² of the smoothing kernel g: the share of white-noise variance each part keeps. */
function noiseGains(): { smoothGain: number; fineGain: number } {
  if (gains) return gains;
  const n = 41,
    impulse = new Float32Array(n * n);
  impulse[20 * n + 20] = 1;
  const g = blur(impulse, n, n, SMOOTH_SIGMA_PX);
  let smoothGain = 0,
    fineGain = 0;
  for (let i = 0; i < g.length; i++) {
    smoothGain += g[i] * g[i];
    fineGain += (impulse[i] - g[i]) ** 2;
  }
  gains = { smoothGain, fineGain };
  return gains;
}

/**
 * Adds one image row to its cells' sums. A function per row, not a loop inside computeTextureMap:
 * V8 optimises a small function called a thousand times for good, where a long loop compiled on
 * the fly (on-stack replacement) was thrown back to the baseline compiler at its first exit. A
 * cell's c pixels are added in registers, rounded to float32 after each addition as the sums'
 * arrays store them, so the sums are those of adding pixel by pixel into the arrays.
 */
function accumulateRow(
  residual: Float32Array,
  intensity: Float32Array,
  smooth: Float32Array,
  slow: Float32Array,
  included: Uint8Array | null,
  row: number,
  crow: number,
  columns: number,
  c: number,
  sums: { m1: Float32Array; m2: Float32Array; f2: Float32Array; mb: Float32Array; w: Float32Array },
): void {
  const { m1, m2, f2, mb, w } = sums;
  const fround = Math.fround;
  for (let cx = 0, i = row; cx < columns; cx++) {
    const j = crow + cx;
    let s1 = m1[j],
      s2 = m2[j],
      sf = f2[j],
      sb = mb[j],
      n = w[j];
    for (const end = i + c; i < end; i++) {
      if (included && !included[i]) continue;
      const band = smooth[i] - slow[i],
        fine = residual[i] - smooth[i];
      s1 = fround(s1 + band);
      s2 = fround(s2 + band * band);
      sf = fround(sf + fine * fine);
      sb = fround(sb + intensity[i]);
      n = fround(n + 1);
    }
    m1[j] = s1;
    m2[j] = s2;
    f2[j] = sf;
    mb[j] = sb;
    w[j] = n;
  }
}

/** computeTextureMap's sums over the cells as a row kernel (SpectrumExecutor.splitRows). */
export interface TextureRowsJob {
  residual: Float32Array;
  intensity: Float32Array;
  smooth: Float32Array;
  slow: Float32Array;
  included: Uint8Array | null;
  width: number;
  cellPx: number;
  columns: number;
  sums: { m1: Float32Array; m2: Float32Array; f2: Float32Array; mb: Float32Array; w: Float32Array };
}

/** Image rows [from, to) of the cells' sums (from a multiple of the cell side). */
export function runTextureRows(job: TextureRowsJob, from: number, to: number): boolean {
  const { residual, intensity, smooth, slow, included, width, cellPx: c, columns: cw, sums } = job;
  for (let y = from; y < to; y++)
    accumulateRow(residual, intensity, smooth, slow, included, y * width, ((y / c) | 0) * cw, cw, c, sums);
  return true;
}

/** Blurs of several grids of one size as a row kernel, a grid per "row" (SpectrumExecutor.splitRows). */
export interface BlurGridsJob {
  grids: Float32Array[];
  /** Each grid's blur is written here. */
  out: Float32Array[];
  width: number;
  height: number;
  sigma: number;
}

/** Grids [from, to) of a BlurGridsJob. */
export function runBlurGrids(job: BlurGridsJob, from: number, to: number): boolean {
  for (let i = from; i < to; i++) job.out[i].set(blur(job.grids[i], job.width, job.height, job.sigma));
  return true;
}

/**
 * The texture map behind the tissue search. The flattened image is smoothed lightly (σ 1.5 px,
 * against pixel noise) and band-passed (minus a blur of the window's σ, so that a residual slow
 * background or the tissue's edge is not texture); its variance in a Gaussian window of σ =
 * shorter side/40 (at least 3 px) less the white-noise share, estimated from the fine rest
 * (image − smoothed) in the same window, is the pattern's variance. Divided by the noise's, it
 * does not depend on illumination for shot-noise-limited frames.
 */
export function computeTextureMap(
  residual: Float32Array,
  intensity: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
): TextureMap | null {
  const c = Math.max(1, Math.ceil(Math.max(width, height) / 256));
  const cw = Math.floor(width / c),
    ch = Math.floor(height / c);
  if (cw < 8 || ch < 8) return null;
  const windowPx = Math.max(3, Math.min(width, height) / 40);
  // Neither blur outlives this call: their working arrays are reused by the next readout.
  const smooth = blur(residual, width, height, SMOOTH_SIGMA_PX, "texture-smooth");
  const slow = blur(smooth, width, height, windowPx, "texture-slow");
  // The cells' sums: with a second thread (SpectrumExecutor.splitRows) it takes the lower rows of
  // cells, from a whole row of cells on; each cell's sums are added by one thread in row order.
  const executor = currentSpectrumExecutor();
  const shared = (a: Float32Array | Uint8Array | null) => !a || a.buffer instanceof SharedArrayBuffer;
  const split =
    executor?.splitRows &&
    width * height >= MIN_PARALLEL_BINS &&
    [residual, intensity, smooth, slow, included].every(shared);
  const cells = () => (split ? new Float32Array(new SharedArrayBuffer(4 * cw * ch)) : new Float32Array(cw * ch));
  const job: TextureRowsJob = {
    residual,
    intensity,
    smooth,
    slow,
    included,
    width,
    cellPx: c,
    columns: cw,
    sums: { m1: cells(), m2: cells(), f2: cells(), mb: cells(), w: cells() },
  };
  const at = c * (ch >> 1),
    end = ch * c;
  const both = split ? executor.splitRows!("texture-rows", job, at, end, () => runTextureRows(job, 0, at)) : null;
  if (both === null) runTextureRows(job, 0, end);
  const { m1, m2, f2, mb, w } = job.sums;
  const windowCells = windowPx / c;
  // The five window sums are blurred two and three to a thread when the cells' sums were split.
  const blurJob: BlurGridsJob = {
    grids: [m1, m2, f2, mb, w],
    out: [m1, m2, f2, mb, w].map(() => cells()),
    width: cw,
    height: ch,
    sigma: windowCells,
  };
  const blurred = split ? executor.splitRows!("blur-grids", blurJob, 3, 5, () => runBlurGrids(blurJob, 0, 3)) : null;
  if (blurred === null) runBlurGrids(blurJob, 0, 5);
  const [b1, b2, bf, bb, bw] = blurJob.out;
  const { smoothGain, fineGain } = noiseGains();
  const logSnr = new Float32Array(cw * ch),
    brightness = new Float32Array(cw * ch),
    sd = new Float32Array(cw * ch),
    use = new Uint8Array(cw * ch);
  for (let j = 0; j < logSnr.length; j++) {
    if (bw[j] <= 0) continue;
    const mean = b1[j] / bw[j];
    // White noise of variance σ² leaves σ²·fineGain in the fine rest and σ²·smoothGain in the smoothed image.
    const noise = ((bf[j] / bw[j]) * smoothGain) / fineGain;
    const texture = b2[j] / bw[j] - mean * mean - noise;
    logSnr[j] = Math.log(Math.max(texture / Math.max(noise, 1e-30), MIN_SNR));
    brightness[j] = bb[j] / bw[j];
    sd[j] = Math.sqrt(Math.max(0, b2[j] / bw[j] - mean * mean));
    use[j] = 2 * w[j] >= c * c ? 1 : 0;
  }
  return { cellPx: c, columns: cw, rows: ch, windowCells, logSnr, brightness, sd, use };
}
