/**
 * Rate limits and lockout (issue 10, item 4): per account (e-mail) and per client address, 429
 * with Retry-After, on password sign-in, sign-in-link requests, sign-up and invitations; a lockout
 * after repeated wrong passwords, said in plain words. Limits are lowered through the config
 * (the defaults are in lib/server/config.ts). Expected behaviour: the rules; Retry-After in
 * seconds per RFC 9110 §10.2.3 (from memory).
 */
import http from "node:http";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { checkPassword } from "@/lib/server/accounts/auth";
import { database } from "@/lib/server/services";
import { guardAuthRequest } from "@/lib/server/accounts/auth-limits";
import { clientAddress, dropClientForwardedFor } from "@/lib/server/web/client-address";
import { lockedForS } from "@/lib/server/web/rate-limit";
import { call, discoverRoutes } from "../support/api";
import { freePort, startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
const R = (k: string) => routes.get(k)!;
let n = 0;

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());
beforeEach(async () => {
  await stack.services.db.sequelize.query("DELETE FROM rate_limits");
  const c = stack.services.config;
  Object.assign(c.rateLimits, {
    signIn: { perAccount: 3, perAddress: 5 },
    signInLink: { perAccount: 2, perAddress: 4 },
    signUp: { perAccount: 2, perAddress: 3 },
    invitation: { perAccount: 2, perAddress: 3 },
  });
  Object.assign(c, { lockoutFailures: 3, lockoutMinutes: 15 });
});

const signup = (email: string, address: string) =>
  call(R("POST /api/v1/signup"), "POST", "/api/v1/signup", {
    json: { name: "Ada Quill", email, password: "long-enough-pw", labName: "Quill Lab" },
    headers: { "x-forwarded-for": address },
  });
const authPost = (action: string, email: string, address: string, extra: Record<string, string> = {}) =>
  new Request(`http://127.0.0.1:3999/api/auth/${action}`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", "x-forwarded-for": address },
    body: new URLSearchParams({ email, ...extra }),
  });

describe("sign-up", () => {
  it("answers 429 with Retry-After after the per-account limit, whatever the address", async () => {
    const email = `limited-${++n}@lab.test`;
    expect((await signup(email, "10.1.0.1")).status).toBe(202);
    expect((await signup(email, "10.1.0.2")).status).toBe(202);
    const res = await signup(email, "10.1.0.3");
    expect(res.status).toBe(429);
    const retry = Number(res.headers.get("retry-after"));
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(15 * 60);
    expect((await res.json()).error.message).toMatch(
      /^too many sign-ups for this account \(at most 2 in 15 minutes\); try again in \d+ minutes?$/,
    );
  });

  it("answers 429 after the per-address limit, for any address typed; another client address is not affected", async () => {
    for (let i = 0; i < 3; i++) expect((await signup(`many-${++n}@lab.test`, "10.2.0.1")).status).toBe(202);
    const res = await signup(`many-${++n}@lab.test`, "10.2.0.1");
    expect(res.status).toBe(429);
    expect((await res.json()).error.message).toContain("from your network address");
    expect((await signup(`many-${++n}@lab.test`, "10.2.0.2")).status).toBe(202);
  });
});

describe("password sign-in", () => {
  it("locks the account after repeated wrong passwords, and says so with the minutes", async () => {
    const email = w.people.manager.email; // password long-enough-pw (tests/support/world.ts)
    for (let i = 0; i < 3; i++) expect(await checkPassword({ email, password: `wrong-${i}` })).toBeNull();
    expect(await lockedForS(email)).toBeGreaterThan(14 * 60);
    // Even the right password does not get in while locked.
    expect(await checkPassword({ email, password: "long-enough-pw" })).toBeNull();
    const res = await guardAuthRequest(
      authPost("callback/credentials", email, "10.3.0.1", { password: "long-enough-pw" }),
      ["callback", "credentials"],
    );
    expect(res?.status).toBe(429);
    expect(Number(res!.headers.get("retry-after"))).toBeGreaterThan(14 * 60);
    const body = (await res!.json()) as { url: string; error: { message: string } };
    expect(new URL(body.url).searchParams.get("error")).toBe("Locked:15");
    expect(body.error.message).toBe(
      "Too many failed sign-ins for this account; try again in 15 minutes or use a sign-in link.",
    );
    // The audit trail has the three failures and the one lockout they started (issue 10, item 12).
    const events = await (await database()).AccountEvent.findAll({ where: { email } });
    expect(events.filter((e) => e.action === "signin.failed")).toHaveLength(3);
    expect(events.filter((e) => e.action === "signin.locked")).toHaveLength(1);
    expect(events.find((e) => e.action === "signin.failed")!.summary).toBe(
      `Failed sign-in as ${email} with password: wrong e-mail or password`,
    );
  });

  it("a right password clears the failure count before the lockout", async () => {
    const email = w.outsider.email;
    await checkPassword({ email, password: "wrong-a" });
    await checkPassword({ email, password: "wrong-b" });
    expect(await checkPassword({ email, password: "long-enough-pw" })).toMatchObject({ email });
    await checkPassword({ email, password: "wrong-c" });
    expect(await lockedForS(email)).toBe(0);
  });

  it("limits attempts per account and per address before next-auth runs", async () => {
    const guard = (email: string, address: string) =>
      guardAuthRequest(authPost("callback/credentials", email, address, { password: "x" }), [
        "callback",
        "credentials",
      ]);
    for (let i = 0; i < 3; i++) expect(await guard("someone@lab.test", `10.4.0.${i}`)).toBeNull();
    expect((await guard("someone@lab.test", "10.4.0.9"))?.status).toBe(429);
    for (let i = 0; i < 5; i++) expect(await guard(`sprayed-${i}@lab.test`, "10.4.1.1")).toBeNull();
    const res = await guard("sprayed-9@lab.test", "10.4.1.1");
    expect(res?.status).toBe(429);
    expect(new URL(((await res!.json()) as { url: string }).url).searchParams.get("error")).toMatch(
      /^RateLimited:\d+$/,
    );
  });
});

describe("sign-in link requests", () => {
  it("answer 429 with Retry-After after the per-account limit", async () => {
    const guard = (address: string) =>
      guardAuthRequest(authPost("signin/email", w.people.scientist.email, address), ["signin", "email"]);
    expect(await guard("10.5.0.1")).toBeNull();
    expect(await guard("10.5.0.2")).toBeNull();
    const res = await guard("10.5.0.3");
    expect(res?.status).toBe(429);
    expect(Number(res!.headers.get("retry-after"))).toBeGreaterThan(0);
  });
});

describe("invitations", () => {
  it("answer 429 after the per-invitee limit", async () => {
    const email = `invited-often-${++n}@lab.test`;
    const invite = () =>
      call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
        token: w.people.manager.token,
        params: { labId: w.labId },
        json: { email, role: "collaborator" },
        headers: { "x-forwarded-for": `10.6.0.${++n}` },
      });
    expect((await invite()).status).toBe(201);
    expect((await invite()).status).toBe(201);
    const res = await invite();
    expect(res.status).toBe(429);
    expect(res.headers.get("retry-after")).toMatch(/^\d+$/);
  });
});

describe("client address", () => {
  const req = (xff?: string) => new Request("http://127.0.0.1/", { headers: xff ? { "x-forwarded-for": xff } : {} });
  it("takes the socket address Next puts in X-Forwarded-For, or with TRUST_PROXY=N the Nth entry from the end", () => {
    expect(clientAddress(req("203.0.113.7"), 0)).toBe("203.0.113.7");
    expect(clientAddress(req("::ffff:127.0.0.1"), 0)).toBe("127.0.0.1");
    expect(clientAddress(req("198.51.100.1, 203.0.113.7"), 1)).toBe("203.0.113.7");
    expect(clientAddress(req("198.51.100.1, 203.0.113.7, 10.0.0.2"), 2)).toBe("203.0.113.7");
    expect(clientAddress(req(), 0)).toBe("unknown");
  });

  it("drops a client-sent X-Forwarded-For before the server sees it (TRUST_PROXY=0)", async () => {
    dropClientForwardedFor();
    const port = await freePort();
    const server = http.createServer((q, s) => s.end(String(q.headers["x-forwarded-for"] ?? "none")));
    await new Promise<void>((r) => server.listen(port, "127.0.0.1", () => r()));
    try {
      const res = await fetch(`http://127.0.0.1:${port}/`, { headers: { "x-forwarded-for": "198.51.100.66" } });
      expect(await res.text()).toBe("none");
    } finally {
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});
