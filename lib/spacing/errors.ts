import { CoreError } from "../errors/core-error";

/** The one reason a spacing table fails: it cannot be read or summarised (the app answers 422). */
export const SPACING_ERROR_CODES = ["bad_table"] as const;
export type SpacingErrorCode = (typeof SPACING_ERROR_CODES)[number];

/** A table that cannot be read or summarised; `row` (1-based, header = 1) and `column` locate it. */
export class SpacingError extends CoreError<SpacingErrorCode> {
  readonly family = "spacing";
  constructor(
    message: string,
    field?: string,
    public row?: number,
    public column?: string,
  ) {
    super("bad_table", message, field);
    this.name = "SpacingError";
  }
}
