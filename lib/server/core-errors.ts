/**
 * The one map from an error to what the API answers: an AppError passes as it is; an error of
 * the science core becomes an AppError by its family and code, with its message unchanged and
 * the field at fault in `details`. Every route wrapper (`errorResponse`), job and child process
 * goes through `toAppError`; anything it returns null for is a bug and answers 500.
 *
 * The table is typed over every code each family exports, so a new code without an HTTP meaning
 * fails the type check (and `tests/lib/errors/core-error-http.test.ts`).
 */
import "server-only";
import type { CoreError, CoreErrorFamily } from "@/lib/errors";
import { isCoreError } from "@/lib/errors";
import type { CodesByFamily } from "@/lib/errors/codes-by-family";
import { AppError, type ErrorCode } from "./errors";

/** Family → code → the API's error code (and so its status, `ERROR_STATUS`). */
export const CORE_ERROR_HTTP: { [F in CoreErrorFamily]: Record<CodesByFamily[F], ErrorCode> } = {
  // too large → 413; a bad option → 400; an image or region with nothing to read → 422.
  readout: {
    zero_area_roi: "unprocessable",
    missing_pixel_size: "unprocessable",
    no_variation: "unprocessable",
    too_large: "too_large",
    bad_option: "bad_input",
    too_small: "unprocessable",
  },
  imaging: { too_large: "too_large", corrupt: "unprocessable", unsupported: "unprocessable", bad_option: "bad_input" },
  spacing: { bad_table: "unprocessable" },
  kinetics: { bad_input: "bad_input", too_large: "too_large", cannot_analyse: "unprocessable" },
  // A fit request that passed the schema but that the fitting core refuses is unprocessable.
  fitting: { bad_option: "unprocessable", bad_data: "unprocessable", no_turing_region: "unprocessable" },
  // The run form's options passed the schema; the solver's own limits are 422 with the field.
  simulation: { bad_option: "unprocessable" },
  synthetic: { bad_option: "bad_input" },
};

/** What the API shows beside the message: the field at fault and, per family, where in the input. */
function detailsOf(err: CoreError): Record<string, unknown> | undefined {
  if (err.family === "spacing") {
    const { row, column } = err as CoreError & { row?: number; column?: string };
    return { field: err.field, row, column };
  }
  if (err.family === "fitting") return { field: err.field, code: err.code };
  return err.field ? { field: err.field } : undefined;
}

/** The API error for `err`, or null when it is not one the app knows (a bug: logged, answered 500). */
export function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (!isCoreError(err)) return null;
  const byCode = CORE_ERROR_HTTP[err.family] as Record<string, ErrorCode> | undefined;
  const code = byCode?.[err.code];
  return code ? new AppError(code, err.message, detailsOf(err)) : null;
}

/** Runs `fn`, rethrowing a core error as its AppError; other errors pass through unchanged. */
export function withAppErrors<T>(fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    throw toAppError(err) ?? err;
  }
}
