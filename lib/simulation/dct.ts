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
  private readonly z: number[];
  private readonly zOut: number[];

  constructor(size: number) {
    this.size = size;
    this.fft = new FFT(size);
    this.cosTw = new Float64Array(size);
    this.sinTw = new Float64Array(size);
    for (let k = 0; k < size; k++) {
      this.cosTw[k] = Math.cos((Math.PI * k) / (2 * size));
      this.sinTw[k] = Math.sin((Math.PI * k) / (2 * size));
    }
    this.z = this.fft.createComplexArray();
    this.zOut = this.fft.createComplexArray();
  }

  /**
   * Forward DCT-II of rows `a` and `b` (offsets into `src`, each `size` long) into `dst` at the
   * same offsets. `src` may equal `dst`. Pass b = −1 for a single row.
   */
  forwardPair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size, z = this.z, Z = this.zOut, cw = this.cosTw, sw = this.sinTw;
    const half = N >> 1;
    for (let n = 0; n < half; n++) {
      const j = 2 * (N - 1 - n);
      z[2 * n] = src[a + 2 * n];
      z[j] = src[a + 2 * n + 1];
      z[2 * n + 1] = b >= 0 ? src[b + 2 * n] : 0;
      z[j + 1] = b >= 0 ? src[b + 2 * n + 1] : 0;
    }
    this.fft.transform(Z, z);
    for (let k = 0; k < N; k++) {
      const m = k === 0 ? 0 : N - k;
      const zr = Z[2 * k], zi = Z[2 * k + 1], mr = Z[2 * m], mi = Z[2 * m + 1];
      // Split the packed spectrum: V^a = (Z_k + conj Z_{N−k})/2, V^b = (Z_k − conj Z_{N−k})/(2i).
      const ar = 0.5 * (zr + mr), ai = 0.5 * (zi - mi);
      dst[a + k] = cw[k] * ar + sw[k] * ai;
      if (b >= 0) {
        const br = 0.5 * (zi + mi), bi = 0.5 * (mr - zr);
        dst[b + k] = cw[k] * br + sw[k] * bi;
      }
    }
  }

  /** Inverse (DCT-III, scaled so it undoes {@link forwardPair}) of rows a and b; b = −1 for one row. */
  inversePair(src: Float64Array, dst: Float64Array, a: number, b: number): void {
    const N = this.size, z = this.z, Z = this.zOut, cw = this.cosTw, sw = this.sinTw;
    for (let k = 0; k < N; k++) {
      // V_k = e^{iπk/2N} (X_k − i X_{N−k}), X_N = 0; then Z = V^a + i V^b.
      const xa = src[a + k], ya = k === 0 ? 0 : src[a + N - k];
      let re = cw[k] * xa + sw[k] * ya;
      let im = sw[k] * xa - cw[k] * ya;
      if (b >= 0) {
        const xb = src[b + k], yb = k === 0 ? 0 : src[b + N - k];
        re -= sw[k] * xb - cw[k] * yb;
        im += cw[k] * xb + sw[k] * yb;
      }
      z[2 * k] = re;
      z[2 * k + 1] = im;
    }
    this.fft.inverseTransform(Z, z);
    const half = N >> 1;
    for (let n = 0; n < half; n++) {
      const j = 2 * (N - 1 - n);
      dst[a + 2 * n] = Z[2 * n];
      dst[a + 2 * n + 1] = Z[j];
      if (b >= 0) {
        dst[b + 2 * n] = Z[2 * n + 1];
        dst[b + 2 * n + 1] = Z[j + 1];
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
