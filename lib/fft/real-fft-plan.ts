import type FFT from "fft.js";
import { getPlan } from "./plans";

/**
 * Real FFT of length N (power of two) in half-complex layout, two rows per complex fft.js
 * transform (Z = FFT(a + ib), A_k = (Z_k + conj Z_{N−k})/2, B_k = (Z_k − conj Z_{N−k})/2i;
 * e.g. Press et al., Numerical Recipes 3rd ed. §12.3).
 * Layout of a row: [Re 0, Re N/2, Re 1, Im 1, Re 2, Im 2, …, Re N/2−1, Im N/2−1]; unnormalised
 * forward, inverse scaled by 1/N so inverse(forward(x)) = x.
 */
export class RealFftPlan {
  readonly size: number;
  private readonly fft: FFT;
  // The shared plan's scratch (plans.ts): fft.js's own complex arrays, which its transform runs
  // faster on than on Float64Array. Every method fills z before it transforms, so sharing the
  // scratch with the other plans of this size is safe in one synchronous thread.
  private readonly z: number[];
  private readonly zOut: number[];

  constructor(size: number) {
    const plan = getPlan(size);
    this.size = size;
    this.fft = plan.fft;
    this.z = plan.a;
    this.zOut = plan.b;
  }

  /** Half-complex forward of rows at offsets a and b (b = −1 for one row); src may equal dst. */
  forwardPair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      z = this.z,
      Z = this.zOut,
      half = N >> 1;
    for (let n = 0; n < N; n++) {
      z[2 * n] = src[a + n];
      z[2 * n + 1] = b >= 0 ? src[b + n] : 0;
    }
    this.fft.transform(Z, z);
    dst[a] = Z[0];
    dst[a + 1] = Z[2 * half];
    if (b >= 0) {
      dst[b] = Z[1];
      dst[b + 1] = Z[2 * half + 1];
    }
    for (let k = 1; k < half; k++) {
      const m = N - k,
        zr = Z[2 * k],
        zi = Z[2 * k + 1],
        mr = Z[2 * m],
        mi = Z[2 * m + 1];
      dst[a + 2 * k] = 0.5 * (zr + mr);
      dst[a + 2 * k + 1] = 0.5 * (zi - mi);
      if (b >= 0) {
        dst[b + 2 * k] = 0.5 * (zi + mi);
        dst[b + 2 * k + 1] = 0.5 * (mr - zr);
      }
    }
  }

  /** Inverse of {@link forwardPair}. */
  inversePair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      z = this.z,
      Z = this.zOut,
      half = N >> 1;
    // Z = A + iB with A, B Hermitian: Z_k = (Ar − Bi) + i(Ai + Br), Z_{N−k} = (Ar + Bi) + i(Br − Ai).
    const b0 = b >= 0 ? src[b] : 0,
      bh = b >= 0 ? src[b + 1] : 0;
    z[0] = src[a];
    z[1] = b0;
    z[2 * half] = src[a + 1];
    z[2 * half + 1] = bh;
    for (let k = 1; k < half; k++) {
      const ar = src[a + 2 * k],
        ai = src[a + 2 * k + 1];
      const br = b >= 0 ? src[b + 2 * k] : 0,
        bi = b >= 0 ? src[b + 2 * k + 1] : 0;
      z[2 * k] = ar - bi;
      z[2 * k + 1] = ai + br;
      z[2 * (N - k)] = ar + bi;
      z[2 * (N - k) + 1] = br - ai;
    }
    this.fft.inverseTransform(Z, z);
    for (let n = 0; n < N; n++) {
      dst[a + n] = Z[2 * n];
      if (b >= 0) dst[b + n] = Z[2 * n + 1];
    }
  }

  /** Complex forward FFT of the complex row (re at offset a, im at offset b), in place. */
  complexForward(data: Float64Array, a: number, b: number, inverse = false): void {
    const N = this.size,
      z = this.z,
      Z = this.zOut;
    for (let n = 0; n < N; n++) {
      z[2 * n] = data[a + n];
      z[2 * n + 1] = data[b + n];
    }
    if (inverse) this.fft.inverseTransform(Z, z);
    else this.fft.transform(Z, z);
    for (let n = 0; n < N; n++) {
      data[a + n] = Z[2 * n];
      data[b + n] = Z[2 * n + 1];
    }
  }

  /** Forward half-complex transform of `rows` consecutive rows. */
  forwardRows(src: Float64Array, dst: Float64Array, rows: number): void {
    const N = this.size;
    let r = 0;
    for (; r + 1 < rows; r += 2) this.forwardPair(src, dst, r * N, (r + 1) * N);
    if (r < rows) this.forwardPair(src, dst, r * N, -1);
  }

  /** Inverse of {@link forwardRows}. */
  inverseRows(src: Float64Array, dst: Float64Array, rows: number): void {
    const N = this.size;
    let r = 0;
    for (; r + 1 < rows; r += 2) this.inversePair(src, dst, r * N, (r + 1) * N);
    if (r < rows) this.inversePair(src, dst, r * N, -1);
  }
}

/** Frequency index |j| of half-complex slot `slot` of a length-N row. */
export function halfComplexFrequency(slot: number, N: number): number {
  return slot === 0 ? 0 : slot === 1 ? N / 2 : slot >> 1;
}
