/** One pass of a running-box mean of half-width r along rows (stride 1) or columns (stride width). */
function boxPass(
  src: Float32Array,
  dst: Float32Array,
  len: number,
  count: number,
  step: number,
  stride: number,
  r: number,
): void {
  for (let line = 0; line < count; line++) {
    const base = line * stride;
    let acc = 0;
    for (let k = 0; k <= Math.min(r, len - 1); k++) acc += src[base + k * step];
    // The box is whole for r ≤ k < len − r − 1: no clamping there.
    const innerFrom = Math.min(len, r),
      innerTo = Math.max(innerFrom, len - r - 1),
      full = 2 * r + 1;
    for (let k = 0; k < innerFrom; k++) {
      const lo = k - r,
        hi = k + r;
      dst[base + k * step] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
      if (hi + 1 < len) acc += src[base + (hi + 1) * step];
      if (lo >= 0) acc -= src[base + lo * step];
    }
    for (let k = innerFrom; k < innerTo; k++) {
      dst[base + k * step] = acc / full;
      acc += src[base + (k + r + 1) * step];
      acc -= src[base + (k - r) * step];
    }
    for (let k = innerTo; k < len; k++) {
      const lo = k - r,
        hi = k + r;
      dst[base + k * step] = acc / (Math.min(hi, len - 1) - Math.max(lo, 0) + 1);
      if (hi + 1 < len) acc += src[base + (hi + 1) * step];
      if (lo >= 0) acc -= src[base + lo * step];
    }
  }
}

/**
 * One running-box pass of half-width r down the columns, all columns at once: rows are read
 * whole and in order (a column at a time would read one value per cache line), the same sums as
 * boxPass with stride `width`.
 */
function boxPassColumns(src: Float32Array, dst: Float32Array, width: number, height: number, r: number): void {
  const acc = new Float64Array(width);
  for (let k = 0; k <= Math.min(r, height - 1); k++) {
    const row = k * width;
    for (let x = 0; x < width; x++) acc[x] += src[row + x];
  }
  for (let k = 0; k < height; k++) {
    const lo = k - r,
      hi = k + r;
    const n = Math.min(hi, height - 1) - Math.max(lo, 0) + 1;
    const out = k * width;
    for (let x = 0; x < width; x++) dst[out + x] = acc[x] / n;
    if (hi + 1 < height) {
      const add = (hi + 1) * width;
      for (let x = 0; x < width; x++) acc[x] += src[add + x];
    }
    if (lo >= 0) {
      const sub = lo * width;
      for (let x = 0; x < width; x++) acc[x] -= src[sub + x];
    }
  }
}

/** Three box passes per axis approximate a Gaussian of SD σ (Wells 1986, IEEE PAMI 8:234). */
export function blur(data: Float32Array, width: number, height: number, sigmaPx: number): Float32Array {
  const r = Math.max(1, Math.round(Math.sqrt(sigmaPx * sigmaPx + 1) - 0.5)); // 3 boxes of width 2r+1: σ² = 3·((2r+1)²−1)/12 ≈ r²
  let a = Float32Array.from(data);
  let b = new Float32Array(data.length);
  for (let p = 0; p < 3; p++) {
    boxPass(a, b, width, height, 1, width, r);
    [a, b] = [b, a];
    boxPassColumns(a, b, width, height, r);
    [a, b] = [b, a];
  }
  return a;
}
