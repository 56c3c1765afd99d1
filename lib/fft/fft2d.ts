import { getPlan } from "./plans";

/**
 * In-place 2-D complex DFT of an interleaved (re, im) row-major array of `height` rows by `width`
 * columns, both powers of two: rows first, then columns. Forward uses e^{−2πi(kx·x/W + ky·y/H)};
 * the inverse divides by W·H, so inverse(forward(x)) = x.
 */
export function fft2dInPlace(data: Float64Array, width: number, height: number, inverse = false): void {
  if (data.length !== 2 * width * height) {
    throw new RangeError(`data must hold 2·width·height = ${2 * width * height} numbers (got ${data.length}).`);
  }
  const row = getPlan(width);
  for (let y = 0; y < height; y++) {
    const off = 2 * y * width,
      a = row.a;
    for (let i = 0; i < 2 * width; i++) a[i] = data[off + i];
    if (inverse) row.fft.inverseTransform(row.b, a);
    else row.fft.transform(row.b, a);
    data.set(row.b, off);
  }
  transformColumns(data, width, height, width, inverse);
}

/** Columns gathered per pass: 8 complex doubles = 128 bytes per row, two cache lines. */
const BLOCK = 8;

/**
 * Complex DFT down each of the first `columns` columns of an interleaved array with row stride
 * `stride` complex values. Shared by the full and the half-spectrum (real-input) transforms.
 * Columns are gathered in blocks so each row's cache line is read once per block, not per column.
 */
export function transformColumns(
  data: Float64Array,
  stride: number,
  height: number,
  columns: number,
  inverse: boolean,
): void {
  const col = getPlan(height);
  // One input and one output array per gathered column, all of fft.js's own kind (plans.ts).
  const gathered = Array.from({ length: BLOCK }, () => col.fft.createComplexArray() as number[]);
  const out = Array.from({ length: BLOCK }, () => col.fft.createComplexArray() as number[]);
  for (let x0 = 0; x0 < columns; x0 += BLOCK) {
    const nb = Math.min(BLOCK, columns - x0);
    for (let y = 0; y < height; y++) {
      const base = 2 * (y * stride + x0);
      for (let c = 0; c < nb; c++) {
        gathered[c][2 * y] = data[base + 2 * c];
        gathered[c][2 * y + 1] = data[base + 2 * c + 1];
      }
    }
    for (let c = 0; c < nb; c++) {
      if (inverse) col.fft.inverseTransform(out[c], gathered[c]);
      else col.fft.transform(out[c], gathered[c]);
    }
    for (let y = 0; y < height; y++) {
      const base = 2 * (y * stride + x0);
      for (let c = 0; c < nb; c++) {
        data[base + 2 * c] = out[c][2 * y];
        data[base + 2 * c + 1] = out[c][2 * y + 1];
      }
    }
  }
}
