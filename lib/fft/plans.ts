import FFT from "fft.js";

/** A fft.js instance with a typed scratch buffer, cached per size (twiddle tables are O(N) to build). */
export interface FftPlan {
  size: number;
  fft: FFT;
  /** Complex scratch of length 2·size, interleaved re, im. */
  a: Float64Array;
  /** A second complex scratch of length 2·size. */
  b: Float64Array;
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
    plan = { size, fft: new FFT(size), a: new Float64Array(2 * size), b: new Float64Array(2 * size) };
    cache.set(size, plan);
  }
  return plan;
}
