import { CoreError } from "../errors/core-error";

/** Every reason a fit could not be started; the app maps every code to HTTP 422. */
export const FIT_ERROR_CODES = ["bad_option", "bad_data", "no_turing_region"] as const;
export type FitErrorCode = (typeof FIT_ERROR_CODES)[number];

/**
 * A typed error raised while validating a fit's input, before any optimisation runs.
 * `field` names the offending option or datum (e.g. `parameters.Du.start`, `data[2].kind`).
 */
export class FitError extends CoreError<FitErrorCode> {
  readonly family = "fitting";
  constructor(code: FitErrorCode, message: string, field?: string) {
    super(code, message, field);
    this.name = "FitError";
  }
}

/** Shorthand for a bad option: `throw badOption("options.seed", "options.seed must be …")`. */
export function badOption(field: string, message: string): FitError {
  return new FitError("bad_option", message, field);
}
