import { CoreError } from "../errors/core-error";

/** Every reason an image could not be read; the app maps `code` to an HTTP status (413 too large, 400 bad option, 422 otherwise). */
export const IMAGING_ERROR_CODES = ["too_large", "corrupt", "unsupported", "bad_option"] as const;
export type ImagingErrorCode = (typeof IMAGING_ERROR_CODES)[number];

/** A typed error from decoding or encoding; `field` names the offending option when there is one. */
export class ImagingError extends CoreError<ImagingErrorCode> {
  readonly family = "imaging";
  constructor(code: ImagingErrorCode, message: string, field?: string) {
    super(code, message, field);
    this.name = "ImagingError";
  }
}
