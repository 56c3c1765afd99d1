/**
 * Sessions that end (issue 10, item 6): a session's JWT carries a session id whose server-side
 * record must be open; signing out closes it, a password change closes the account's other
 * sessions. Driven through next-auth's own callbacks and events (what getServerSession runs on
 * every request); tests/e2e/signin-link.spec.ts replays a real cookie after sign-out.
 * Expected behaviour: the rules (common practice, no source).
 */
import type { Session } from "next-auth";
import type { JWT } from "next-auth/jwt";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authOptions, checkPassword } from "@/lib/server/accounts/auth";
import { changePassword } from "@/lib/server/accounts/accounts";
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

/** A session as next-auth makes it at sign-in: the jwt callback with the signed-in user. */
async function signIn(userId: string, email: string): Promise<JWT> {
  return (await authOptions().callbacks!.jwt!({
    token: { email },
    user: { id: userId, email },
    trigger: "signIn",
  } as never)) as JWT;
}
/** What the cookie is worth on a later request: the jwt callback without user, then the session callback. */
async function sessionOf(token: JWT): Promise<Session> {
  const t = (await authOptions().callbacks!.jwt!({ token } as never)) as JWT;
  return authOptions().callbacks!.session!({
    session: { expires: new Date(Date.now() + 3_600_000).toISOString(), user: { email: t.email } },
    token: t,
  } as never) as Promise<Session>;
}

describe("sessions", () => {
  it("a session works until sign-out and not after it", async () => {
    const p = w.people.scientist;
    const token = await signIn(p.userId, p.email);
    expect(typeof token.sid).toBe("string");
    expect((await sessionOf(token)).user?.id).toBe(p.userId);
    await authOptions().events!.signOut!({ token, session: undefined as never });
    expect((await sessionOf(token)).user).toBeUndefined();
  });

  it("signing out one session leaves the account's other sessions open", async () => {
    const p = w.people.modeller;
    const a = await signIn(p.userId, p.email);
    const b = await signIn(p.userId, p.email);
    await authOptions().events!.signOut!({ token: a, session: undefined as never });
    expect((await sessionOf(b)).user?.id).toBe(p.userId);
  });

  it("a JWT without a session id (issued before this change, or forged without the record) is no session", async () => {
    const p = w.people.collaborator;
    expect((await sessionOf({ uid: p.userId, email: p.email } as JWT)).user).toBeUndefined();
  });

  it("changing the password ends the account's other sessions, keeps the one that asked, and the new password works", async () => {
    const p = w.people.manager; // password long-enough-pw (tests/support/world.ts)
    const here = await signIn(p.userId, p.email);
    const elsewhere = await signIn(p.userId, p.email);
    const result = await changePassword(
      { ...p.actor, via: "session" },
      { currentPassword: "long-enough-pw", newPassword: "a-new-long-password" },
      here.sid!,
    );
    expect(result).toEqual({ changed: true, endedSessions: 1 });
    expect((await sessionOf(elsewhere)).user).toBeUndefined();
    expect((await sessionOf(here)).user?.id).toBe(p.userId);
    expect(await checkPassword({ email: p.email, password: "long-enough-pw" })).toBeNull();
    expect(await checkPassword({ email: p.email, password: "a-new-long-password" })).toMatchObject({ email: p.email });
  });

  it("the password route refuses a wrong current password (401) and a short new one (400, as sign-up)", async () => {
    const route = routes.get("POST /api/v1/me/password")!;
    const wrong = await call(route, "POST", "/api/v1/me/password", {
      token: w.outsider.token,
      json: { currentPassword: "not-it", newPassword: "another-long-password" },
    });
    expect(wrong.status).toBe(401);
    expect((await wrong.json()).error.message).toBe("current password: that is not your current password");
    const short = await call(route, "POST", "/api/v1/me/password", {
      token: w.outsider.token,
      json: { currentPassword: "long-enough-pw", newPassword: "short" },
    });
    expect(short.status).toBe(400);
    expect((await short.json()).error.message).toBe("New password: at least 10 characters");
    const ok = await call(route, "POST", "/api/v1/me/password", {
      token: w.outsider.token,
      json: { currentPassword: "long-enough-pw", newPassword: "another-long-password" },
    });
    expect(ok.status).toBe(200);
  });
});
