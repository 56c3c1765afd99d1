/**
 * Cross-site request forgery guard. A browser sends cookies with every request to this host,
 * whoever's page started it; it also sends `Origin` (or at least `Referer`) on every request that
 * is not GET/HEAD (Fetch standard, "append a request `Origin` header"). So a state-changing
 * request that carries a cookie must name this app as its origin. Requests with
 * `Authorization: Bearer …` carry no ambient credential and are exempt (OWASP CSRF Prevention
 * Cheat Sheet, "Verifying Origin With Standard Headers").
 */
import "server-only";

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** The origin the request was addressed to: Host header (what the browser used) and scheme. */
function ownOrigin(request: Request): string | null {
  const url = new URL(request.url);
  const host = request.headers.get("host") ?? url.host;
  const proto = request.headers.get("x-forwarded-proto")?.split(",")[0]?.trim() || url.protocol.replace(/:$/, "");
  try {
    return new URL(`${proto}://${host}`).origin;
  } catch {
    return null;
  }
}

function originOf(value: string): string | null {
  try {
    const o = new URL(value).origin;
    return o === "null" ? null : o;
  } catch {
    return null;
  }
}

/**
 * Why the request must be refused, or null when it may go on. `appUrl` is the app's configured
 * public address (NEXTAUTH_URL); the request's own Host is accepted too, so 127.0.0.1 and
 * localhost both work on a laptop.
 */
export function crossSiteRefusal(request: Request, appUrl: string): string | null {
  if (!STATE_CHANGING.has(request.method.toUpperCase())) return null;
  if (/^Bearer\s/i.test(request.headers.get("authorization") ?? "")) return null;
  if (!request.headers.get("cookie")) return null;
  const allowed = new Set([originOf(appUrl), ownOrigin(request)].filter((o): o is string => o !== null));
  const origin = request.headers.get("origin");
  const referer = request.headers.get("referer");
  const claimed = origin !== null ? originOf(origin) : referer !== null ? originOf(referer) : undefined;
  if (claimed === undefined) {
    return "this request carries a session cookie but neither an Origin nor a Referer header; send it from Morphokin's own pages, or use an API token (Authorization: Bearer …) from scripts";
  }
  if (claimed === null || !allowed.has(claimed)) {
    return `this request comes from another site (${origin !== null ? `Origin ${origin}` : `Referer ${referer}`}), not from Morphokin's own pages (${[...allowed].join(" or ")}); it was refused to protect your session`;
  }
  return null;
}
