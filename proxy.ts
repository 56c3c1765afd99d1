/**
 * Runs before pages and next-auth's own endpoints (not /api/v1, whose route wrappers check the
 * same things, and not uploads, whose bodies must stream untouched):
 * - pages get a Content-Security-Policy with a fresh nonce (Next puts it on its scripts);
 * - /api/auth/** state-changing requests must come from this app's pages (CSRF) and carry a
 *   small body with a Content-Length, refused before next-auth reads anything.
 * The fixed security headers come from next.config.ts (lib/web/security-headers.ts).
 */
import { NextResponse, type NextRequest } from "next/server";
import { readConfig } from "@/lib/server/config";
import { crossSiteRefusal } from "@/lib/server/web/same-origin";
import { newNonce, pageCsp } from "@/lib/web/security-headers";

/** Largest body of a next-auth request (a sign-in form: e-mail, password, CSRF token), bytes. */
export const AUTH_BODY_LIMIT_BYTES = 16 * 1024;

const refuse = (status: number, code: string, message: string) =>
  NextResponse.json({ error: { code, message } }, { status });

function checkAuthRequest(request: NextRequest): NextResponse | null {
  const refusal = crossSiteRefusal(request, readConfig().appUrl);
  if (refusal) return refuse(403, "forbidden", refusal);
  if (request.method === "GET" || request.method === "HEAD") return null;
  const length = request.headers.get("content-length");
  if (length === null) {
    if (request.headers.get("transfer-encoding"))
      return refuse(411, "length_required", "send the request body with a Content-Length header");
    return null;
  }
  if (Number(length) > AUTH_BODY_LIMIT_BYTES) {
    return refuse(
      413,
      "too_large",
      `the request body is larger than the limit of ${AUTH_BODY_LIMIT_BYTES / 1024} KiB for this request; send less data`,
    );
  }
  return null;
}

export function proxy(request: NextRequest) {
  if (request.nextUrl.pathname.startsWith("/api/")) return checkAuthRequest(request) ?? NextResponse.next();
  const nonce = newNonce();
  const csp = pageCsp(nonce, {
    development: readConfig().developmentBuild,
    https: readConfig().appUrl.startsWith("https:"),
  });
  const headers = new Headers(request.headers);
  headers.set("x-nonce", nonce);
  // The page's path, for the 403 page that says what the visitor's role may not do there.
  headers.set("x-morphokin-path", request.nextUrl.pathname);
  headers.set("content-security-policy", csp);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("content-security-policy", csp);
  return response;
}

export const config = {
  // Everything but /api/v1 (its own wrappers), Next's static files and the icon.
  matcher: ["/((?!api/v1/|_next/static/|_next/image|favicon\\.ico).*)"],
};
