import type FFT from "fft.js";
import { getPlan } from "./plans";

/**
 * Type-II discrete cosine transform of length N (a power of two) and its inverse (type III),
 * computed with fft.js by Makhoul's N-point method (Makhoul J. (1980) IEEE Trans. ASSP 28:27):
 * reorder v[n] = x[2n], v[N−1−n] = x[2n+1]; V = FFT(v); X_k = Re(e^{−iπk/2N} V_k).
 * Two real rows share one complex FFT (real part row a, imaginary part row b), which measured
 * fastest on fft.js (see tests/bench/simulation.bench.ts).
 *
 * Convention: X_k = Σ_n x_n cos(πk(2n+1)/(2N)) (unnormalised); the inverse returns
 * x_n = (1/N)[X_0 + 2 Σ_{k≥1} X_k cos(πk(2n+1)/(2N))], so inverse(forward(x)) = x.
 *
 * Besides rows (contiguous), a pair of adjacent columns of a row-major block can be read
 * directly ({@link forwardColumnPair}, {@link inverseColumnPair}), so a 2-D transform needs no
 * transpose: the gather touches each cache line of the block for four column pairs in a row,
 * which stay in L1.
 */
export class DctPlan {
  readonly size: number;
  private readonly fft: FFT;
  /** ½cos(πk/2N), ½sin(πk/2N): the forward post-twiddle with the ½ of the spectrum split. */
  private readonly cosHalf: Float64Array;
  private readonly sinHalf: Float64Array;
  /** cos(πk/2N)/N, sin(πk/2N)/N: the inverse pre-twiddle with the 1/N of the inverse FFT. */
  private readonly cosInv: Float64Array;
  private readonly sinInv: Float64Array;
  // The shared plan's scratch (plans.ts): fft.js's own complex arrays (JS arrays of doubles),
  // on which fft.js's transform measured ≈ 30 % faster than on Float64Array
  // (tests/bench/simulation.bench.ts). fft.js's code is shared by every caller in a process, so a
  // process that also passed Float64Array to it would make its element accesses polymorphic,
  // slower for both. Every method fills z before it transforms, so sharing is safe in one thread.
  private readonly z: number[];
  private readonly zOut: number[];

  constructor(size: number) {
    const plan = getPlan(size);
    this.size = size;
    this.fft = plan.fft;
    this.cosHalf = new Float64Array(size);
    this.sinHalf = new Float64Array(size);
    this.cosInv = new Float64Array(size);
    this.sinInv = new Float64Array(size);
    // ½ and 1/N are powers of two, so folding them into the twiddles changes no rounding.
    for (let k = 0; k < size; k++) {
      const c = Math.cos((Math.PI * k) / (2 * size)),
        s = Math.sin((Math.PI * k) / (2 * size));
      this.cosHalf[k] = 0.5 * c;
      this.sinHalf[k] = 0.5 * s;
      this.cosInv[k] = c / size;
      this.sinInv[k] = s / size;
    }
    this.z = plan.a;
    this.zOut = plan.b;
  }

  /**
   * Forward DCT-II of rows `a` and `b` (offsets into `src`, each `size` long) into `dst` at the
   * same offsets. `src` may equal `dst`. Pass b = −1 for a single row.
   */
  forwardPair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      z = this.z,
      half = N >> 1;
    if (b >= 0) {
      for (let n = 0; n < half; n++) {
        const j = 2 * (N - 1 - n);
        z[2 * n] = src[a + 2 * n];
        z[j] = src[a + 2 * n + 1];
        z[2 * n + 1] = src[b + 2 * n];
        z[j + 1] = src[b + 2 * n + 1];
      }
      this.fft.transform(this.zOut, z);
      this.splitForward(dst, a, b);
      return;
    }
    for (let n = 0; n < half; n++) {
      const j = 2 * (N - 1 - n);
      z[2 * n] = src[a + 2 * n];
      z[j] = src[a + 2 * n + 1];
      z[2 * n + 1] = 0;
      z[j + 1] = 0;
    }
    this.fft.transform(this.zOut, z);
    const Z = this.zOut,
      cw = this.cosHalf,
      sw = this.sinHalf;
    dst[a] = Z[0];
    const h = N >> 1;
    for (let k = 1; k < h; k++) {
      const m = N - k;
      const zr = Z[2 * k],
        zi = Z[2 * k + 1],
        mr = Z[2 * m],
        mi = Z[2 * m + 1];
      dst[a + k] = cw[k] * (zr + mr) + sw[k] * (zi - mi);
      dst[a + m] = cw[m] * (mr + zr) + sw[m] * (mi - zi);
    }
    dst[a + h] = cw[h] * (Z[2 * h] + Z[2 * h]) + sw[h] * (Z[2 * h + 1] - Z[2 * h + 1]);
  }

  /**
   * Forward DCT-II along columns `col` and `col + 1` of a row-major block whose rows are
   * `stride` apart (`size` rows), into the rows at offsets a and b of `dst` (dst ≠ src).
   */
  forwardColumnPair(src: Float64Array, stride: number, col: number, dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      z = this.z,
      half = N >> 1;
    let p = col;
    for (let n = 0; n < half; n++) {
      const j = 2 * (N - 1 - n);
      z[2 * n] = src[p];
      z[2 * n + 1] = src[p + 1];
      p += stride;
      z[j] = src[p];
      z[j + 1] = src[p + 1];
      p += stride;
    }
    this.fft.transform(this.zOut, z);
    this.splitForward(dst, a, b);
  }

  /** Post-twiddle of a packed pair: V^a = (Z_k + conj Z_{N−k})/2, V^b = (Z_k − conj Z_{N−k})/(2i). */
  private splitForward(dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      Z = this.zOut,
      cw = this.cosHalf,
      sw = this.sinHalf;
    // k = 0: V^a_0 = Re Z_0, V^b_0 = Im Z_0, twiddle 1. Modes k and N − k read the same four
    // numbers, so one iteration writes both (k = N/2 is its own partner).
    dst[a] = Z[0];
    dst[b] = Z[1];
    const h = N >> 1;
    for (let k = 1; k < h; k++) {
      const m = N - k;
      const zr = Z[2 * k],
        zi = Z[2 * k + 1],
        mr = Z[2 * m],
        mi = Z[2 * m + 1];
      const ck = cw[k],
        sk = sw[k],
        cm = cw[m],
        sm = sw[m];
      dst[a + k] = ck * (zr + mr) + sk * (zi - mi);
      dst[b + k] = ck * (zi + mi) + sk * (mr - zr);
      dst[a + m] = cm * (mr + zr) + sm * (mi - zi);
      dst[b + m] = cm * (mi + zi) + sm * (zr - mr);
    }
    const hr = Z[2 * h],
      hi = Z[2 * h + 1],
      ch = cw[h],
      sh = sw[h];
    dst[a + h] = ch * (hr + hr) + sh * (hi - hi);
    dst[b + h] = ch * (hi + hi) + sh * (hr - hr);
  }

  /** Inverse (DCT-III, scaled so it undoes {@link forwardPair}) of rows a and b; b = −1 for one row. */
  inversePair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      z = this.z,
      cw = this.cosInv,
      sw = this.sinInv;
    // V_k = e^{iπk/2N} (X_k − i X_{N−k}), X_N = 0; Z = V^a + i V^b. The inverse FFT is taken as
    // conj(FFT(conj Z))/N so the 1/N and the conjugations fold into these two loops.
    const inv = 1 / N;
    if (b >= 0) {
      z[0] = src[a] * inv;
      z[1] = -src[b] * inv;
      const h = N >> 1;
      // Modes k and N − k read the same four numbers, so one iteration writes both.
      for (let k = 1; k < h; k++) {
        const m = N - k;
        const xa = src[a + k],
          ya = src[a + m],
          xb = src[b + k],
          yb = src[b + m];
        const ck = cw[k],
          sk = sw[k],
          cm = cw[m],
          sm = sw[m];
        z[2 * k] = ck * xa + sk * ya - (sk * xb - ck * yb);
        z[2 * k + 1] = -(sk * xa - ck * ya + (ck * xb + sk * yb));
        z[2 * m] = cm * ya + sm * xa - (sm * yb - cm * xb);
        z[2 * m + 1] = -(sm * ya - cm * xa + (cm * yb + sm * xb));
      }
      const xa = src[a + h],
        xb = src[b + h],
        ch = cw[h],
        sh = sw[h];
      z[2 * h] = ch * xa + sh * xa - (sh * xb - ch * xb);
      z[2 * h + 1] = -(sh * xa - ch * xa + (ch * xb + sh * xb));
      this.fft.transform(this.zOut, z);
      this.scatterInverse(dst, a, b);
      return;
    }
    z[0] = src[a] * inv;
    z[1] = 0;
    for (let k = 1; k < N; k++) {
      const c = cw[k],
        s = sw[k];
      const xa = src[a + k],
        ya = src[a + N - k];
      z[2 * k] = c * xa + s * ya;
      z[2 * k + 1] = -(s * xa - c * ya);
    }
    this.fft.transform(this.zOut, z);
    const Z = this.zOut,
      half = N >> 1;
    for (let n = 0; n < half; n++) {
      dst[a + 2 * n] = Z[2 * n];
      dst[a + 2 * n + 1] = Z[2 * (N - 1 - n)];
    }
  }

  /**
   * Inverse along columns `col` and `col + 1` of a row-major block of coefficients whose rows
   * are `stride` apart (`size` rows), into the rows at offsets a and b of `dst` (dst ≠ src).
   */
  inverseColumnPair(src: Float64Array, stride: number, col: number, dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      z = this.z,
      cw = this.cosInv,
      sw = this.sinInv,
      inv = 1 / N;
    z[0] = src[col] * inv;
    z[1] = -src[col + 1] * inv;
    const h = N >> 1;
    let p = col + stride,
      q = col + (N - 1) * stride;
    // As in inversePair: modes k and N − k in one iteration.
    for (let k = 1; k < h; k++) {
      const m = N - k;
      const xa = src[p],
        xb = src[p + 1],
        ya = src[q],
        yb = src[q + 1];
      const ck = cw[k],
        sk = sw[k],
        cm = cw[m],
        sm = sw[m];
      z[2 * k] = ck * xa + sk * ya - (sk * xb - ck * yb);
      z[2 * k + 1] = -(sk * xa - ck * ya + (ck * xb + sk * yb));
      z[2 * m] = cm * ya + sm * xa - (sm * yb - cm * xb);
      z[2 * m + 1] = -(sm * ya - cm * xa + (cm * yb + sm * xb));
      p += stride;
      q -= stride;
    }
    const xa = src[p],
      xb = src[p + 1],
      ch = cw[h],
      sh = sw[h];
    z[2 * h] = ch * xa + sh * xa - (sh * xb - ch * xb);
    z[2 * h + 1] = -(sh * xa - ch * xa + (ch * xb + sh * xb));
    this.fft.transform(this.zOut, z);
    this.scatterInverse(dst, a, b);
  }

  /** Undoes Makhoul's reordering for a packed pair (the conjugation gives row b's sign). */
  private scatterInverse(dst: Float64Array, a: number, b: number): void {
    const N = this.size,
      Z = this.zOut,
      half = N >> 1;
    for (let n = 0; n < half; n++) {
      const j = 2 * (N - 1 - n);
      dst[a + 2 * n] = Z[2 * n];
      dst[a + 2 * n + 1] = Z[j];
      dst[b + 2 * n] = -Z[2 * n + 1];
      dst[b + 2 * n + 1] = -Z[j + 1];
    }
  }

  /** Forward DCT-II of `rows` consecutive rows of length `size` starting at `offset`. */
  forwardRows(src: Float64Array, dst: Float64Array, rows: number, offset = 0): void {
    const N = this.size;
    let r = 0;
    for (; r + 1 < rows; r += 2) this.forwardPair(src, dst, offset + r * N, offset + (r + 1) * N);
    if (r < rows) this.forwardPair(src, dst, offset + r * N, -1);
  }

  /** Inverse of {@link forwardRows}. */
  inverseRows(src: Float64Array, dst: Float64Array, rows: number, offset = 0): void {
    const N = this.size;
    let r = 0;
    for (; r + 1 < rows; r += 2) this.inversePair(src, dst, offset + r * N, offset + (r + 1) * N);
    if (r < rows) this.inversePair(src, dst, offset + r * N, -1);
  }
}
