import FFT from "fft.js";

/**
 * A fft.js instance with scratch buffers, cached per size (twiddle tables are O(N) to build): the
 * one set of plans behind every transform here — the readout's 2-D FFTs and the solver's
 * RealFftPlan and DctPlan. The scratch is fft.js's own complex arrays (JS arrays of doubles):
 * fft.js is ≈ 30 % faster on them than on Float64Array, and one kind for every caller in a
 * process keeps its shared code monomorphic (lib/simulation/README.md, Speed). Callers fill the
 * scratch before each transform and keep nothing in it between calls, so one thread shares it.
 */
export interface FftPlan {
  size: number;
  fft: FFT;
  /** Complex scratch of length 2·size, interleaved re, im. */
  a: number[];
  /** A second complex scratch of length 2·size. */
  b: number[];
}

const cache = new Map<number, FftPlan>();

/** True when n is a power of two ≥ 2 (what fft.js accepts). */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 2 && (n & (n - 1)) === 0;
}

/** Smallest power of two ≥ max(n, 2). */
export function nextPowerOfTwo(n: number): number {
  let p = 2;
  while (p < n) p *= 2;
  return p;
}

export function getPlan(size: number): FftPlan {
  let plan = cache.get(size);
  if (!plan) {
    if (!isPowerOfTwo(size)) throw new RangeError(`FFT size must be a power of two of at least 2 (got ${size}).`);
    const fft = new FFT(size);
    plan = { size, fft, a: fft.createComplexArray() as number[], b: fft.createComplexArray() as number[] };
    cache.set(size, plan);
  }
  return plan;
}
