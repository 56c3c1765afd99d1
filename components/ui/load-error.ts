import { ApiError } from "@/lib/client/api";

/**
 * A failed read in words a user can act on. A 4xx carries the server's own message (it names the
 * field or filter); a 5xx or an unreadable answer says it was the server, a rejected fetch says the
 * server could not be reached. Internal text (stack, SQL) never reaches the page.
 */
export function describeLoadError(what: string, error: unknown): string {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return error.message;
  if (error instanceof ApiError)
    return `${what} could not be loaded: the server answered with an error (${error.status}). Try again in a moment.`;
  return `${what} could not be loaded: the server could not be reached. Check the connection and try again.`;
}
