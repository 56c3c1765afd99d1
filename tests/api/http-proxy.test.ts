/**
 * proxy.ts: the pages' CSP with a fresh nonce, and the guards on next-auth's own endpoints, whose
 * files are not ours to change (a body limit from Content-Length before next-auth reads anything,
 * and the same-origin rule). Statuses: RFC 9110 §15.5.12 (411), §15.5.14 (413); CSP directives:
 * CSP Level 3 (W3C) and the Next docs, guides/content-security-policy.
 */
import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import { AUTH_BODY_LIMIT_BYTES, proxy } from "@/proxy";

const APP = "http://127.0.0.1:3000";
const post = (path: string, headers: Record<string, string>) =>
  new NextRequest(`${APP}${path}`, { method: "POST", headers });
const messageOf = async (res: Response) => ((await res.json()) as { error: { message: string } }).error.message;

describe("next-auth's endpoints", () => {
  it("a 5 MB sign-in body is a 413 from its Content-Length, before next-auth runs", async () => {
    const res = proxy(
      post("/api/auth/callback/credentials", {
        "content-type": "application/x-www-form-urlencoded",
        "content-length": String(5_000_000),
        origin: APP,
        cookie: "next-auth.csrf-token=x",
      }),
    );
    expect(res.status).toBe(413);
    expect(await messageOf(res)).toBe(
      `the request body is larger than the limit of ${AUTH_BODY_LIMIT_BYTES / 1024} KiB for this request; send less data`,
    );
  });

  it("a body without a length is refused (411), so it cannot be large", async () => {
    const res = proxy(post("/api/auth/signin/email", { "transfer-encoding": "chunked", origin: APP }));
    expect(res.status).toBe(411);
    expect(await messageOf(res)).toBe("send the request body with a Content-Length header");
  });

  it("a cookie-carrying POST from another site is a 403; the app's own form goes through", async () => {
    const evil = proxy(
      post("/api/auth/signout", {
        cookie: "next-auth.session-token=s",
        origin: "http://127.0.0.1:8081",
        "content-length": "10",
      }),
    );
    expect(evil.status).toBe(403);
    expect(await messageOf(evil)).toContain("this request comes from another site (Origin http://127.0.0.1:8081)");
    const own = proxy(
      post("/api/auth/signout", { cookie: "next-auth.session-token=s", origin: APP, "content-length": "10" }),
    );
    expect(own.headers.get("x-middleware-next")).toBe("1");
  });
});

describe("pages", () => {
  it("get a CSP with a fresh nonce per request, scripts by nonce only, no unsafe-eval outside development", () => {
    const csp = (res: Response) => res.headers.get("content-security-policy") ?? "";
    const a = proxy(new NextRequest(`${APP}/login`));
    const b = proxy(new NextRequest(`${APP}/login`));
    const nonceOf = (s: string) => /'nonce-([A-Za-z0-9+/=]+)'/.exec(s)?.[1];
    expect(nonceOf(csp(a))).toMatch(/^[A-Za-z0-9+/]{22}==$/); // 16 random bytes in base64
    expect(nonceOf(csp(a))).not.toBe(nonceOf(csp(b)));
    expect(csp(a)).toContain(`script-src 'self' 'nonce-${nonceOf(csp(a))}' 'strict-dynamic';`);
    expect(csp(a)).not.toContain("unsafe-eval");
    expect(csp(a)).toContain("frame-ancestors 'none'");
    expect(csp(a)).toContain("object-src 'none'");
    // Next reads the nonce from the request's CSP header when it renders the page.
    expect(a.headers.get("x-middleware-request-content-security-policy")).toBe(csp(a));
  });
});
