/**
 * The client's network address, for per-address rate limits.
 *
 * `next start` sets X-Forwarded-For to the socket's address, but only when the request has no such
 * header (node_modules/next/dist/server/base-server.js: `req.headers['x-forwarded-for'] ??= …`),
 * so a client could choose its own. With TRUST_PROXY=0 (the default: the app is reached directly),
 * instrumentation.ts removes a client-sent X-Forwarded-For before Next sees it
 * (`dropClientForwardedFor`), and the header is the socket address. With TRUST_PROXY=N, N reverse
 * proxies in front each append the address they saw, and the Nth entry from the end is the
 * client's as the outermost trusted proxy saw it; entries before it are the client's own claims.
 */
import "server-only";
import http from "node:http";

export function clientAddress(request: Request, trustProxyHops: number): string {
  const header = request.headers.get("x-forwarded-for");
  if (!header) return "unknown";
  const entries = header
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  if (entries.length === 0) return "unknown";
  const index = Math.max(0, entries.length - Math.max(1, trustProxyHops));
  return entries[index].replace(/^::ffff:/, "");
}

const g = globalThis as unknown as { __morphokinXffGuard?: boolean };

/** Installs, once per process, the removal of client-sent X-Forwarded-For headers (TRUST_PROXY=0). */
export function dropClientForwardedFor(): void {
  if (g.__morphokinXffGuard) return;
  g.__morphokinXffGuard = true;
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function patchedEmit(
    this: http.Server,
    event: string | symbol,
    ...args: unknown[]
  ): boolean {
    if (event === "request") delete (args[0] as http.IncomingMessage).headers["x-forwarded-for"];
    return (emit as (this: http.Server, event: string | symbol, ...a: unknown[]) => boolean).call(this, event, ...args);
  } as typeof emit;
}
