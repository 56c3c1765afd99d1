/**
 * A single-channel image as the numerical core sees it: row-major `data[y * width + x]`.
 * Synthetic generators and `decodeImage` return values in 0..1; the readout accepts any finite values.
 */
export interface GreyImage {
  /** Columns (px). */
  width: number;
  /** Rows (px). */
  height: number;
  /** Row-major pixel values, length `width * height`. */
  data: Float32Array;
}
