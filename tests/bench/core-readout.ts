import type { ReadoutOptions } from "@/lib/readout";

/**
 * The readout the side-by-side bench times against `numpy_reference.py WORK readout`: the same
 * steps (plane removal, Hann window, real 2-D FFT, |F|², radial average, peak with refinement;
 * the readout also fits the local background and reads the symmetry), without the sub-region
 * uncertainty and the autocorrelation cross-check, which the numpy script does not do. Named
 * explicitly so a change of a default does not silently change what is compared.
 */
export const CORE_READOUT: ReadoutOptions = {
  pixelSizeUm: 1,
  flatten: "plane",
  window: "hann",
  subregions: false,
  autocorrelation: false,
};
