export { makeStripes, type StripesOptions } from "./make-stripes";
export { makeHexSpots, type HexSpotsOptions } from "./make-hex-spots";
export { makeLabyrinth, type LabyrinthOptions } from "./make-labyrinth";
export { makeNoise, type NoiseOptions } from "./make-noise";
export { makeGradientStripes, gradientWavelengthAtPx, type GradientStripesOptions } from "./make-gradient-stripes";
export { SyntheticOptionError, SYNTHETIC_ERROR_CODES, MAX_SYNTHETIC_SIDE_PX } from "./check-options";
export { createRng, type Rng } from "./random";
export type { GreyImage } from "../imaging/grey-image";
export { makeMicroscopeFrame, type MicroscopeFrameOptions } from "./make-microscope-frame";
