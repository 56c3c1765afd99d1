/**
 * Every security header of the app, in one place. `next.config.ts` sends the fixed ones on every
 * response (pages, API answers, downloads, static files) and the API's CSP; `proxy.ts` sends the
 * pages' CSP with a fresh nonce per request, which Next reads from the request header and puts on
 * its own scripts (Next docs, guides/content-security-policy). No imports: next.config.ts loads it.
 */

/** Sent on every response. */
export const FIXED_SECURITY_HEADERS: readonly { key: string; value: string }[] = [
  // Old browsers that ignore CSP frame-ancestors.
  { key: "X-Frame-Options", value: "DENY" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  {
    key: "Permissions-Policy",
    value:
      "camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), hid=(), midi=(), magnetometer=(), gyroscope=(), accelerometer=(), display-capture=(), browsing-topics=()",
  },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
];

/** API answers and downloads are never documents to render: no scripts, no styles, no framing. */
export const API_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'; sandbox";

/**
 * The pages' policy. Scripts: only those carrying this request's nonce (Next adds it to its own),
 * and what they load ('strict-dynamic'); `'unsafe-eval'` only in development, where React uses
 * eval for its debugging stacks. Styles: `'unsafe-inline'`, because React renders `style="…"`
 * attributes (progress bars, chart positions, recharts) that a nonce cannot cover; styles cannot
 * run code, so the script policy carries the protection.
 */
export function pageCsp(nonce: string, options: { development: boolean; https: boolean }): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(options.https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

/** 128 random bits, base64: unguessable per response. */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
