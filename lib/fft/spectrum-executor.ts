/** Precision of the half spectrum kept between the row and the column transforms. */
export type SpectrumPrecision = "float32" | "float64";

/** One |F|² of a real image (see realPowerSpectrum2d), as handed to an executor. */
export interface HalfPowerJob {
  src: Float32Array;
  srcWidth: number;
  srcHeight: number;
  width: number;
  height: number;
  windowX?: Float64Array;
  windowY?: Float64Array;
  precision: SpectrumPrecision;
  /** |F|² may be an array reused by the executor's next such job (see RealPowerSpectrumOptions). */
  reusePower?: boolean;
}

/**
 * Runs the row and column transforms of realPowerSpectrum2d, possibly on several threads
 * (lib/parallel/spectrum-threads.ts). Each row and each column is one transform computed by the
 * same code on whichever thread, so the result is bit-identical to the serial one. lib/fft stays
 * free of worker threads: an executor is installed by the process that has them (a command,
 * a child process, the bench).
 */
export interface SpectrumExecutor {
  /** |F|² (rows of width/2 + 1), or null to let the caller compute it serially. */
  halfPower(job: HalfPowerJob): Float32Array | null;
  /**
   * A pass over an image's rows split between the threads: the other thread runs `kernel` (a row
   * kernel its worker knows, lib/parallel/row-kernels.ts) on rows [split, end) of `job` while the
   * caller runs `own` (the rows before split). True when both parts returned true, false when
   * either did not; null when it cannot (the caller then runs every row itself). Whatever the
   * kernel writes must be in shared memory, and so should any large input (others are copied).
   */
  splitRows?(kernel: RowKernel, job: object, split: number, end: number, own: () => boolean): boolean | null;
}

/** The row kernels an executor's worker can run (each computes its rows exactly as the caller would). */
export type RowKernel =
  | "residual-rows"
  | "region-stats"
  | "scale-samples"
  | "box-rows"
  | "box-columns"
  | "radial-rows"
  | "texture-rows"
  | "blur-grids";

/** Transforms smaller than this (bins) stay on the calling thread: waking a thread costs more. */
export const MIN_PARALLEL_BINS = 1 << 20;

let installed: SpectrumExecutor | null = null;

/** Installs (or, with null, removes) the executor used for large transforms in this thread. */
export function setSpectrumExecutor(executor: SpectrumExecutor | null): void {
  installed = executor;
}

export function currentSpectrumExecutor(): SpectrumExecutor | null {
  return installed;
}
