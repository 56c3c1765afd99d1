/** Why a fit could not be started; the app maps every code to HTTP 422. */
export type FitErrorCode = "bad_option" | "bad_data" | "no_turing_region";

/**
 * A typed error raised while validating a fit's input, before any optimisation runs.
 * `field` names the offending option or datum (e.g. `parameters.Du.start`, `data[2].kind`).
 */
export class FitError extends Error {
  constructor(
    public code: FitErrorCode,
    message: string,
    public field?: string,
  ) {
    super(message);
    this.name = "FitError";
  }
}

/** Shorthand for a bad option: `throw badOption("options.seed", "options.seed must be …")`. */
export function badOption(field: string, message: string): FitError {
  return new FitError("bad_option", message, field);
}
