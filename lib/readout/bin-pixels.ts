/**
 * Averages `factor × factor` blocks (the partial blocks at the right and bottom edges are dropped).
 * Used when a region is larger than the analysis limit: the wavelength in pixels divides by the
 * factor and the pixel size multiplies by it, so the wavelength in µm is unchanged.
 */
export function binPixels(
  data: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  factor: number,
) {
  const w = Math.floor(width / factor);
  const h = Math.floor(height / factor);
  const out = new Float32Array(w * h);
  if (!included) {
    // Without a mask every block is full: sum whole source rows into a row of block sums.
    const acc = new Float64Array(w);
    const norm = 1 / (factor * factor);
    for (let by = 0; by < h; by++) {
      acc.fill(0);
      for (let y = by * factor; y < (by + 1) * factor; y++) {
        const row = y * width;
        for (let bx = 0, i = row; bx < w; bx++) {
          let s = 0;
          for (const end = i + factor; i < end; i++) s += data[i];
          acc[bx] += s;
        }
      }
      for (let bx = 0; bx < w; bx++) out[by * w + bx] = acc[bx] * norm;
    }
    return { data: out, width: w, height: h, included: null };
  }
  const inc = new Uint8Array(w * h);
  for (let by = 0; by < h; by++) {
    for (let bx = 0; bx < w; bx++) {
      let s = 0,
        n = 0;
      for (let y = by * factor; y < (by + 1) * factor; y++) {
        for (let x = bx * factor; x < (bx + 1) * factor; x++) {
          const i = y * width + x;
          if (included[i]) {
            s += data[i];
            n++;
          }
        }
      }
      out[by * w + bx] = n > 0 ? s / n : 0;
      inc[by * w + bx] = 2 * n >= factor * factor ? 1 : 0;
    }
  }
  return { data: out, width: w, height: h, included: inc };
}
