import FFT from "fft.js";

/**
 * Type-II discrete cosine transform of length N (a power of two) and its inverse (type III),
 * computed with fft.js by Makhoul's N-point method (Makhoul J. (1980) IEEE Trans. ASSP 28:27):
 * reorder v[n] = x[2n], v[N−1−n] = x[2n+1]; V = FFT(v); X_k = Re(e^{−iπk/2N} V_k).
 * Two real rows share one complex FFT (real part row a, imaginary part row b), which measured
 * fastest on fft.js (see tests/bench/simulation.bench.ts).
 *
 * Convention: X_k = Σ_n x_n cos(πk(2n+1)/(2N)) (unnormalised); the inverse returns
 * x_n = (1/N)[X_0 + 2 Σ_{k≥1} X_k cos(πk(2n+1)/(2N))], so inverse(forward(x)) = x.
 */
export class DctPlan {
  readonly size: number;
  private readonly fft: FFT;
  private readonly cosTw: Float64Array;
  private readonly sinTw: Float64Array;
  // Float64Array scratch: fft.js accepts any indexable; its own createComplexArray gives holey
  // JS arrays, which measured slower in the pair loops.
  private readonly z: Float64Array;
  private readonly zOut: Float64Array;

  constructor(size: number) {
    this.size = size;
    this.fft = new FFT(size);
    this.cosTw = new Float64Array(size);
    this.sinTw = new Float64Array(size);
    for (let k = 0; k < size; k++) {
      this.cosTw[k] = Math.cos((Math.PI * k) / (2 * size));
      this.sinTw[k] = Math.sin((Math.PI * k) / (2 * size));
    }
    this.z = new Float64Array(2 * size);
    this.zOut = new Float64Array(2 * size);
  }

  /**
   * Forward DCT-II of rows `a` and `b` (offsets into `src`, each `size` long) into `dst` at the
   * same offsets. `src` may equal `dst`. Pass b = −1 for a single row.
   */
  forwardPair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size, z = this.z, Z = this.zOut, cw = this.cosTw, sw = this.sinTw;
    const half = N >> 1, two = b >= 0;
    if (two) {
      for (let n = 0; n < half; n++) {
        const j = 2 * (N - 1 - n);
        z[2 * n] = src[a + 2 * n];
        z[j] = src[a + 2 * n + 1];
        z[2 * n + 1] = src[b + 2 * n];
        z[j + 1] = src[b + 2 * n + 1];
      }
    } else {
      for (let n = 0; n < half; n++) {
        const j = 2 * (N - 1 - n);
        z[2 * n] = src[a + 2 * n];
        z[j] = src[a + 2 * n + 1];
        z[2 * n + 1] = 0;
        z[j + 1] = 0;
      }
    }
    this.fft.transform(Z, z);
    // k = 0: V^a_0 = Re Z_0, V^b_0 = Im Z_0, twiddle 1.
    dst[a] = Z[0];
    if (two) dst[b] = Z[1];
    for (let k = 1; k < N; k++) {
      const m = N - k;
      const zr = Z[2 * k], zi = Z[2 * k + 1], mr = Z[2 * m], mi = Z[2 * m + 1];
      const c = cw[k], s = sw[k];
      // Split the packed spectrum: V^a = (Z_k + conj Z_{N−k})/2, V^b = (Z_k − conj Z_{N−k})/(2i).
      dst[a + k] = 0.5 * (c * (zr + mr) + s * (zi - mi));
      if (two) dst[b + k] = 0.5 * (c * (zi + mi) + s * (mr - zr));
    }
  }

  /** Inverse (DCT-III, scaled so it undoes {@link forwardPair}) of rows a and b; b = −1 for one row. */
  inversePair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size, z = this.z, Z = this.zOut, cw = this.cosTw, sw = this.sinTw;
    const two = b >= 0;
    // V_k = e^{iπk/2N} (X_k − i X_{N−k}), X_N = 0; Z = V^a + i V^b. The inverse FFT is taken as
    // conj(FFT(conj Z))/N so the 1/N and the conjugations fold into these two loops.
    z[0] = src[a];
    z[1] = two ? -src[b] : 0;
    for (let k = 1; k < N; k++) {
      const c = cw[k], s = sw[k];
      const xa = src[a + k], ya = src[a + N - k];
      let re = c * xa + s * ya;
      let im = s * xa - c * ya;
      if (two) {
        const xb = src[b + k], yb = src[b + N - k];
        re -= s * xb - c * yb;
        im += c * xb + s * yb;
      }
      z[2 * k] = re;
      z[2 * k + 1] = -im;
    }
    this.fft.transform(Z, z);
    const half = N >> 1, inv = 1 / N;
    for (let n = 0; n < half; n++) {
      const j = 2 * (N - 1 - n);
      dst[a + 2 * n] = Z[2 * n] * inv;
      dst[a + 2 * n + 1] = Z[j] * inv;
      if (two) {
        dst[b + 2 * n] = -Z[2 * n + 1] * inv;
        dst[b + 2 * n + 1] = -Z[j + 1] * inv;
      }
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
