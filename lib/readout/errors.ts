import { CoreError } from "../errors/core-error";

/** Every reason a readout could not be made; the app maps `too_large` to 413 and the rest to 422 (or 400 for `bad_option`). */
export const READOUT_ERROR_CODES = [
  "zero_area_roi",
  "missing_pixel_size",
  "no_variation",
  "too_large",
  "bad_option",
  "too_small",
] as const;
export type ReadoutErrorCode = (typeof READOUT_ERROR_CODES)[number];

/** A typed readout error; `field` names the option or input at fault. */
export class ReadoutError extends CoreError<ReadoutErrorCode> {
  readonly family = "readout";
  constructor(code: ReadoutErrorCode, message: string, field?: string) {
    super(code, message, field);
    this.name = "ReadoutError";
  }
}

export const MESSAGES = {
  missingPixelSize: "pixelSizeUm is required: the image has no pixel size in its metadata, so give it in µm/px.",
  zeroAreaRoi:
    "The region of interest contains no pixels: give a rectangle or polygon with a positive area inside the image.",
  noVariation:
    "The region of interest has no intensity variation (all included pixels are equal after background flattening), so there is no pattern to read.",
  tooSmall: (w: number, h: number, min: number) =>
    `The region of interest (${w}×${h} px) is too small: both sides must be at least ${min} px.`,
  tooLarge: (px: number, max: number) => `The image has ${px} pixels, above the readout limit of ${max} pixels.`,
} as const;
