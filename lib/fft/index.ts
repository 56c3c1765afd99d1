export { fft2dInPlace } from "./fft2d";
export { realFft2d, inverseRealFft2d, halfPowerSpectrum, type HalfSpectrum } from "./real-fft2d";
export { isPowerOfTwo, nextPowerOfTwo } from "./plans";
export { DctPlan } from "./dct-plan";
export { RealFftPlan, halfComplexFrequency } from "./real-fft-plan";
export {
  realPowerSpectrum2d,
  halfSpectrumLength,
  transformRows,
  transformColumnsToPower,
  type HalfPower,
  type RealPowerSpectrumOptions,
  type SpectrumPrecision,
} from "./real-power-spectrum2d";
export {
  setSpectrumExecutor,
  currentSpectrumExecutor,
  MIN_PARALLEL_BINS,
  type SpectrumExecutor,
  type HalfPowerJob,
  type RowKernel,
} from "./spectrum-executor";
