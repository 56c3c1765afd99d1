/** Taper applied before the FFT against edge leakage. */
export type WindowKind = "hann" | "tukey" | "none";

/**
 * 1-D window of length n. Hann: w = ½(1 − cos(2πk/(n−1))); Tukey(α): flat centre, Hann-shaped
 * tapers over a fraction α of the length (Harris 1978, Proc. IEEE 66:51).
 */
export function makeWindow1d(kind: WindowKind, n: number, tukeyAlpha = 0.25): Float64Array {
  const w = new Float64Array(n).fill(1);
  if (kind === "none" || n < 3) return w;
  const m = n - 1;
  for (let k = 0; k < n; k++) {
    if (kind === "hann") w[k] = 0.5 * (1 - Math.cos((2 * Math.PI * k) / m));
    else {
      const edge = (tukeyAlpha * m) / 2;
      const d = Math.min(k, m - k);
      w[k] = d >= edge ? 1 : 0.5 * (1 - Math.cos((Math.PI * d) / edge));
    }
  }
  return w;
}

/** Multiplies in place by the separable 2-D window w(x)·w(y). */
export function applyWindow(
  data: Float32Array,
  width: number,
  height: number,
  kind: WindowKind,
  tukeyAlpha = 0.25,
): void {
  if (kind === "none") return;
  const wx = makeWindow1d(kind, width, tukeyAlpha);
  const wy = makeWindow1d(kind, height, tukeyAlpha);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const fy = wy[y];
    for (let x = 0; x < width; x++) data[row + x] *= fy * wx[x];
  }
}
