/**
 * Cross-site requests, content types and body sizes at the route wrappers (every /api/v1 route goes
 * through them). Expected statuses: 403 for a request from another site with the app's cookie
 * (OWASP CSRF Prevention Cheat Sheet, "Verifying Origin With Standard Headers"), 415 for a body
 * that is not application/json (RFC 9110 §15.5.16), 413 above the size limit (RFC 9110 §15.5.14);
 * the messages are the product's own (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEFAULT_JSON_LIMIT_BYTES } from "@/lib/server/web/http";
import { call, discoverRoutes } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

const STUDIES = "/api/v1/labs/[labId]/studies";
const study = { name: "Guarded", tissue: "skin", organism: "chick" };
const errorOf = async (res: Response) => ((await res.json()) as { error: { code: string; message: string } }).error;
// The app's address in tests is the configured default (lib/server/config.ts), and the test
// requests go to http://127.0.0.1:3999 (tests/support/api.ts): both are "this app".
const APP = "http://127.0.0.1:3000";
const COOKIE = "next-auth.session-token=victim-session";

const createStudy = (headers: Record<string, string>, token?: string) =>
  call(routes.get(`POST ${STUDIES}`)!, "POST", STUDIES, { token, params: { labId: w.labId }, json: study, headers });

describe("cross-site requests (CSRF)", () => {
  it("refuses a cookie-carrying write from another origin, naming it; the app's own origin, API tokens and reads go through", async () => {
    const res = await createStudy({ cookie: COOKIE, origin: "http://127.0.0.1:8081" });
    expect(res.status).toBe(403);
    expect((await errorOf(res)).message).toBe(
      "this request comes from another site (Origin http://127.0.0.1:8081), not from Morphokin's own pages (http://127.0.0.1:3000 or http://127.0.0.1:3999); it was refused to protect your session",
    );
    // The app's own origin passes the check; then the session decides (none in tests: 401).
    const own: Record<string, string>[] = [
      { origin: APP },
      { origin: "http://127.0.0.1:3999" },
      { referer: `${APP}/labs/x/studies` },
    ];
    for (const headers of own) expect((await createStudy({ cookie: COOKIE, ...headers })).status).toBe(401);
    // An API token is no ambient credential; a read changes nothing.
    expect((await createStudy({ cookie: COOKIE, origin: "http://evil.test" }, w.people.scientist.token)).status).toBe(
      201,
    );
    const list = await call(routes.get(`GET ${STUDIES}`)!, "GET", STUDIES, {
      token: w.people.scientist.token,
      params: { labId: w.labId },
      headers: { cookie: COOKIE, origin: "http://evil.test" },
    });
    expect(list.status).toBe(200);
  });

  it("refuses a cookie-carrying write with neither Origin nor Referer, and falls back to Referer", async () => {
    const none = await createStudy({ cookie: COOKIE });
    expect(none.status).toBe(403);
    expect((await errorOf(none)).message).toBe(
      "this request carries a session cookie but neither an Origin nor a Referer header; send it from Morphokin's own pages, or use an API token (Authorization: Bearer …) from scripts",
    );
    const badReferer = await createStudy({ cookie: COOKIE, referer: "http://evil.test/page" });
    expect(badReferer.status).toBe(403);
    expect((await errorOf(badReferer)).message).toContain("(Referer http://evil.test/page)");
    expect((await errorOf(await createStudy({ cookie: COOKIE, origin: "null" }))).code).toBe("forbidden");
  });

  it("covers the sign-up route and DELETE too", async () => {
    const signup = await call(routes.get("POST /api/v1/signup")!, "POST", "/api/v1/signup", {
      json: { name: "X", email: "csrf@lab.test", password: "long-enough-pw", labName: "CSRF Lab" },
      headers: { cookie: COOKIE, origin: "http://evil.test" },
    });
    expect(signup.status).toBe(403);
    const del = await call(
      routes.get("DELETE /api/v1/labs/[labId]/studies/[studyId]")!,
      "DELETE",
      "/api/v1/labs/[labId]/studies/[studyId]",
      {
        params: { labId: w.labId, studyId: "00000000-0000-4000-8000-000000000000" },
        headers: { cookie: COOKIE, origin: "http://evil.test" },
      },
    );
    expect(del.status).toBe(403);
  });
});

describe("JSON only as application/json", () => {
  it("refuses a text/plain JSON body with 415 naming the type, before doing anything", async () => {
    const res = await call(routes.get(`POST ${STUDIES}`)!, "POST", STUDIES, {
      token: w.people.scientist.token,
      params: { labId: w.labId },
      body: JSON.stringify(study),
      headers: { "content-type": "text/plain;charset=UTF-8" },
    });
    expect(res.status).toBe(415);
    expect((await errorOf(res)).message).toBe(
      "the request body must be JSON sent as Content-Type: application/json (it was sent as text/plain)",
    );
    const withCharset = await call(routes.get(`POST ${STUDIES}`)!, "POST", STUDIES, {
      token: w.people.scientist.token,
      params: { labId: w.labId },
      body: JSON.stringify(study),
      headers: { "content-type": "application/json; charset=utf-8" },
    });
    expect(withCharset.status).toBe(201);
  });

  it("refuses a JSON body sent without a Content-Type, on the readout route (its own body reader) too", async () => {
    const res = await call(routes.get(`POST ${STUDIES}`)!, "POST", STUDIES, {
      token: w.people.scientist.token,
      params: { labId: w.labId },
      body: new TextEncoder().encode(JSON.stringify(study)),
    });
    expect(res.status).toBe(415);
    expect((await errorOf(res)).message).toBe(
      "the request body must be JSON sent as Content-Type: application/json (it was sent without a Content-Type)",
    );
    const R = "/api/v1/labs/[labId]/uploads/[uploadId]/readouts";
    const readout = await call(routes.get(`POST ${R}`)!, "POST", R, {
      token: w.people.scientist.token,
      params: { labId: w.labId, uploadId: "00000000-0000-4000-8000-000000000000" },
      body: "{}",
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    expect(readout.status).toBe(415);
  });
});

/** A body of `total` bytes that counts how much of it the server pulled. */
function countingBody(total: number, chunk = 64 * 1024) {
  const state = { pulled: 0 };
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        if (state.pulled >= total) return controller.close();
        const n = Math.min(chunk, total - state.pulled);
        state.pulled += n;
        controller.enqueue(new Uint8Array(n).fill(0x20));
      },
    },
    { highWaterMark: 0 },
  );
  return { stream, state };
}

describe("body size limits", () => {
  const FIVE_MB = 5 * 1000 * 1000;
  const signup = (body: BodyInit, headers: Record<string, string>) =>
    call(routes.get("POST /api/v1/signup")!, "POST", "/api/v1/signup", {
      body,
      headers: { "content-type": "application/json", ...headers },
    });

  it("a 5 MB sign-up body with its length is a 413 naming the limit, and not a byte of it is read", async () => {
    const { stream, state } = countingBody(FIVE_MB);
    const res = await signup(stream, { "content-length": String(FIVE_MB) });
    expect(res.status).toBe(413);
    expect((await errorOf(res)).message).toBe(
      "the request body is larger than the limit of 1 MiB for this request; send less data",
    );
    expect(state.pulled).toBe(0);
    // Just under the limit: read and checked as usual.
    const padded =
      JSON.stringify({ ...study, description: "x".repeat(100) }) + " ".repeat(DEFAULT_JSON_LIMIT_BYTES - 400);
    const under = await call(routes.get(`POST ${STUDIES}`)!, "POST", STUDIES, {
      token: w.people.scientist.token,
      params: { labId: w.labId },
      body: padded,
      headers: { "content-type": "application/json" },
    });
    expect(under.status).toBe(201);
  });

  it("a 5 MB sign-up body without a length is cut off at the limit, never read whole", async () => {
    const { stream, state } = countingBody(FIVE_MB);
    const res = await signup(stream, {});
    expect(res.status).toBe(413);
    expect((await errorOf(res)).message).toBe(
      "the request body is larger than the limit of 1 MiB for this request; send less data",
    );
    // At most the limit plus the chunk that crossed it (and one the stream may have queued).
    expect(state.pulled).toBeLessThanOrEqual(DEFAULT_JSON_LIMIT_BYTES + 2 * 64 * 1024);
  });
});
