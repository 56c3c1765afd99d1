/** Why an image could not be read; the app maps `code` to an HTTP status (413 too large, 422 otherwise). */
export type ImagingErrorCode = "too_large" | "corrupt" | "unsupported" | "bad_option";

/** A typed error from decoding or encoding; `field` names the offending option when there is one. */
export class ImagingError extends Error {
  constructor(
    public code: ImagingErrorCode,
    message: string,
    public field?: string,
  ) {
    super(message);
    this.name = "ImagingError";
  }
}
