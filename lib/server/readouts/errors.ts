/** Errors of the numerical core turned into the app's error type, with their HTTP meaning. */
import { ImagingError } from "@/lib/imaging";
import { ReadoutError } from "@/lib/readout";
import { SpacingError } from "@/lib/spacing";
import { AppError } from "../errors";

/** too_large → 413; bad_option → 400; what cannot be analysed (corrupt, no variation, …) → 422. */
export function toReadoutAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof ReadoutError || err instanceof ImagingError) {
    const code = err.code === "too_large" ? "too_large" : err.code === "bad_option" ? "bad_input" : "unprocessable";
    return new AppError(code, err.message, err.field ? { field: err.field } : undefined);
  }
  if (err instanceof SpacingError) {
    return new AppError("unprocessable", err.message, { field: err.field, row: err.row, column: err.column });
  }
  return null;
}
