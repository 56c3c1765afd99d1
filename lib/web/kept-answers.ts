/**
 * How each web process's front door (lib/cli/front-door.ts) reaches the answers that the API's
 * list and detail routes keep (lib/server/web/answer-cache.ts). The routes run inside Next's
 * server bundle and the front door outside it, in the same process: the bundle's lab-route.ts
 * puts its lookup on globalThis under KEPT_ANSWERS, and the front door calls it for each GET
 * with a token before handing the request to Next. No imports: both sides load this file.
 */

/** A kept 200 JSON answer, exactly as its route made it. */
export interface KeptAnswer {
  status: number;
  /** The route's own headers (content-type, cache-control). */
  headers: [string, string][];
  body: Uint8Array<ArrayBuffer>;
}

/**
 * The answer kept for this token (the Authorization header as sent) and this path and query, when
 * it may be given again now; null when the route must make it (nothing kept, the database changed,
 * too old, the token expired).
 */
export type KeptAnswerLookup = (authorization: string, pathAndQuery: string) => Promise<KeptAnswer | null>;

/** The global key of the lookup (Symbol.for: the same symbol in the bundle and outside it). */
export const KEPT_ANSWERS = Symbol.for("morphokin.kept-answers");

/** The lookup the bundle put on globalThis, or null before the first API route has loaded. */
export function keptAnswerLookup(): KeptAnswerLookup | null {
  return (globalThis as { [KEPT_ANSWERS]?: KeptAnswerLookup })[KEPT_ANSWERS] ?? null;
}

/** Puts the bundle's lookup on globalThis (lab-route.ts, when it loads). */
export function offerKeptAnswers(lookup: KeptAnswerLookup): void {
  (globalThis as { [KEPT_ANSWERS]?: KeptAnswerLookup })[KEPT_ANSWERS] = lookup;
}

/**
 * The path and query an answer is kept under: the URL's, as WHATWG URL parsing normalises them
 * (the same on both sides: Next's request.url and node's req.url).
 */
export function answerPath(url: string): string {
  const u = new URL(url, "http://localhost");
  return `${u.pathname}${u.search}`;
}
