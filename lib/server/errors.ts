/**
 * The one error type route handlers turn into `{ error: { code, message, details? } }`.
 * `message` is what the user sees; internals are logged, never shown.
 */
import "server-only";

export const ERROR_STATUS = {
  bad_input: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  unavailable: 503,
} as const;
export type ErrorCode = keyof typeof ERROR_STATUS;

export class AppError extends Error {
  constructor(
    public code: ErrorCode,
    message: string,
    public details?: unknown,
  ) {
    super(message);
    this.name = "AppError";
  }
  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export const notFound = (what: string) => new AppError("not_found", `${what} not found`);
export const forbidden = (message = "your role in this lab does not allow this") => new AppError("forbidden", message);

/**
 * The server is saturated: a 503 whose message says when to come back, sent with the same
 * `Retry-After` header (RFC 9110 §10.2.3), so scripts and people both know to retry.
 */
export class ServerBusyError extends AppError {
  constructor(
    public retryAfterS: number,
    reason: string,
  ) {
    super("unavailable", `the server is busy (${reason}); try again in ${retryAfterS} s`);
  }
}
export const serverBusy = (retryAfterS: number, reason: string) => new ServerBusyError(retryAfterS, reason);
