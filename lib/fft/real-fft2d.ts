import { transformColumns } from "./fft2d";
import { getPlan } from "./plans";

/**
 * The non-redundant half of the 2-D DFT of a real image: columns kx = 0 … W/2 of every row ky.
 * The other half follows from Hermitian symmetry F(−kx, −ky) = conj F(kx, ky) (real input).
 */
export interface HalfSpectrum {
  /** Transform width W (power of two). */
  width: number;
  /** Transform height H (power of two). */
  height: number;
  /** Stored columns, W/2 + 1. */
  halfWidth: number;
  /** Interleaved (re, im), row-major, `height` rows of `halfWidth` complex values. */
  data: Float64Array;
}

/**
 * Forward 2-D DFT of a real `srcWidth × srcHeight` image placed at the top-left of a zero-filled
 * `width × height` transform (zero padding). Rows are transformed two at a time (one complex transform
 * per pair of real rows), then the columns of the half spectrum.
 */
export function realFft2d(
  src: Float32Array | Float64Array,
  srcWidth: number,
  srcHeight: number,
  width: number,
  height: number,
): HalfSpectrum {
  if (src.length !== srcWidth * srcHeight)
    throw new RangeError(`src must hold srcWidth·srcHeight = ${srcWidth * srcHeight} values (got ${src.length}).`);
  if (srcWidth > width || srcHeight > height)
    throw new RangeError(`the image (${srcWidth}×${srcHeight}) must fit in the transform (${width}×${height}).`);
  const halfWidth = width / 2 + 1;
  const data = new Float64Array(2 * halfWidth * height);
  const plan = getPlan(width);
  const { a, b } = plan;
  // Two real rows per complex transform: z = x₁ + i·x₂ gives X₁[k] = (Z[k] + conj Z[W−k])/2 and
  // X₂[k] = (Z[k] − conj Z[W−k])/(2i) (Press et al., Numerical Recipes, 3rd ed., §12.3).
  for (let y = 0; y < srcHeight; y += 2) {
    const second = y + 1 < srcHeight;
    a.fill(0);
    for (let x = 0; x < srcWidth; x++) {
      a[2 * x] = src[y * srcWidth + x];
      if (second) a[2 * x + 1] = src[(y + 1) * srcWidth + x];
    }
    plan.fft.transform(b, a);
    const o1 = 2 * y * halfWidth;
    const o2 = o1 + 2 * halfWidth;
    for (let k = 0; k < halfWidth; k++) {
      const m = k === 0 ? 0 : width - k;
      const zr = b[2 * k],
        zi = b[2 * k + 1],
        wr = b[2 * m],
        wi = b[2 * m + 1];
      data[o1 + 2 * k] = 0.5 * (zr + wr);
      data[o1 + 2 * k + 1] = 0.5 * (zi - wi);
      if (second) {
        data[o2 + 2 * k] = 0.5 * (zi + wi);
        data[o2 + 2 * k + 1] = -0.5 * (zr - wr);
      }
    }
  }
  // Rows beyond srcHeight are zero padding: their transforms are zero, already in `data`.
  getPlan(height);
  transformColumns(data, halfWidth, height, halfWidth, false);
  return { width, height, halfWidth, data };
}

/** Inverse of {@link realFft2d}: the real `width × height` image (including the padding). */
export function inverseRealFft2d(spectrum: HalfSpectrum): Float64Array {
  const { width, height, halfWidth } = spectrum;
  const work = spectrum.data.slice();
  transformColumns(work, halfWidth, height, halfWidth, true);
  const plan = getPlan(width);
  const { a, b } = plan;
  const out = new Float64Array(width * height);
  // Each row r of `work` is the DFT of a real row, so X[W−k] = conj X[k]. Two rows at once:
  // Z = X₁ + i·X₂ inverts to x₁ + i·x₂ (linearity), so the real and imaginary parts are the rows.
  for (let y = 0; y < height; y += 2) {
    const o1 = 2 * y * halfWidth;
    const o2 = o1 + 2 * halfWidth;
    for (let k = 0; k < halfWidth; k++) {
      const r1 = work[o1 + 2 * k],
        i1 = work[o1 + 2 * k + 1],
        r2 = work[o2 + 2 * k],
        i2 = work[o2 + 2 * k + 1];
      a[2 * k] = r1 - i2;
      a[2 * k + 1] = i1 + r2;
      if (k > 0 && k < width / 2) {
        // conj X₁ + i·conj X₂ at W−k
        a[2 * (width - k)] = r1 + i2;
        a[2 * (width - k) + 1] = -i1 + r2;
      }
    }
    plan.fft.inverseTransform(b, a);
    for (let x = 0; x < width; x++) {
      out[y * width + x] = b[2 * x];
      out[(y + 1) * width + x] = b[2 * x + 1];
    }
  }
  return out;
}

/** |F|² of every stored bin, as Float32 (row-major, `height × halfWidth`). */
export function halfPowerSpectrum(spectrum: HalfSpectrum): Float32Array {
  const { data } = spectrum;
  const out = new Float32Array(data.length / 2);
  for (let i = 0; i < out.length; i++) out[i] = data[2 * i] * data[2 * i] + data[2 * i + 1] * data[2 * i + 1];
  return out;
}
