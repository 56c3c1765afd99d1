/**
 * "Forgot your password?" (issue 16, Accounts): the same answer for every address, a one-time link
 * to an account only, stored hashed, valid for a limited time, used once; the new password signs
 * the account out everywhere and is an account event. Rate-limited like sign-in.
 * Expected behaviour: the rules (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkPassword } from "@/lib/server/accounts/auth";
import { openSession, sessionIsOpen } from "@/lib/server/accounts/sessions";
import { listOwnAccountEvents } from "@/lib/server/audit";
import { sha256Hex } from "@/lib/server/secrets";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { listMail, waitForMailWithSubject } from "../support/mail";
import { startTestStack, type TestStack } from "../support/stack";
import { makePerson, makeWorld, type World } from "../support/world";

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

const SUBJECT = "Reset your Morphokin password";
const ask = (email: string, address = `10.9.0.${++n % 250}`) =>
  call(R("POST /api/v1/password-reset"), "POST", "/api/v1/password-reset", {
    json: { email },
    headers: { "x-forwarded-for": address },
  });
const reset = (token: string, newPassword: string) =>
  call(R("POST /api/v1/password-reset/confirm"), "POST", "/api/v1/password-reset/confirm", {
    json: { token, newPassword },
  });
const errorOf = async (res: Response) => ((await res.json()) as { error: { message: string } }).error;

/** A fresh account (so tests do not share a rate-limit bucket or a password) and its reset link's token. */
async function personWithLink() {
  const p = await makePerson("scientist", w.labId, `reset${++n}`);
  expect((await ask(p.email)).status).toBe(202);
  const mail = await waitForMailWithSubject(stack.mailboxUrl, p.email, SUBJECT);
  const token = /\/reset-password\/(\S+)/.exec(mail.text)![1];
  return { p, token, mail };
}

describe("password reset", () => {
  it("answers a known and an unknown address with the same status and body, and mails only the account", async () => {
    const known = await makePerson("scientist", w.labId, "known");
    const unknown = `nobody-${Date.now()}@lab.test`;
    const a = await ask(known.email);
    const b = await ask(unknown);
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(await a.json()).toEqual(await b.json());
    await waitForMailWithSubject(stack.mailboxUrl, known.email, SUBJECT);
    // The known address's mail has arrived, so one for the unknown address would have too (same path).
    expect(await listMail(stack.mailboxUrl, unknown)).toEqual([]);
  });

  it("mails a link that says how long it works, stores only its hash, and sets a new password once", async () => {
    const { p, token, mail } = await personWithLink();
    expect(mail.text).toContain("expires in 60 minutes");
    const m = await database();
    const rows = await m.AccountLink.findAll({ where: { userId: p.userId, kind: "password-reset" } });
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(sha256Hex(token));
    expect(JSON.stringify(rows[0].toJSON())).not.toContain(token);

    const ok = await reset(token, "a-fresh-password-1");
    expect(ok.status).toBe(200);
    expect(await checkPassword({ email: p.email, password: "a-fresh-password-1" })).toMatchObject({ email: p.email });

    const again = await reset(token, "a-fresh-password-2");
    expect(again.status).toBe(409);
    expect((await errorOf(again)).message).toBe("this password reset link was already used; ask for a new one");
    expect(await checkPassword({ email: p.email, password: "a-fresh-password-2" })).toBeNull();
  });

  it("refuses an expired link with a message that says to ask again, and changes nothing", async () => {
    const { p, token } = await personWithLink();
    const m = await database();
    await m.AccountLink.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: p.userId } });
    const res = await reset(token, "never-set-password");
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe("this password reset link has expired; ask for a new one");
    expect(await checkPassword({ email: p.email, password: "never-set-password" })).toBeNull();
  });

  it("refuses an unknown link (404) and a short new password (400) naming the field", async () => {
    const unknown = await reset("pr_not-a-real-token", "long-enough-password");
    expect(unknown.status).toBe(404);
    expect((await errorOf(unknown)).message).toBe(
      "this password reset link is not valid; check that you copied the whole link from the e-mail, or ask for a new one",
    );
    const { token } = await personWithLink();
    const short = await reset(token, "short");
    expect(short.status).toBe(400);
    expect((await errorOf(short)).message).toContain("at least 10 characters");
  });

  it("ends every session of the account, retires its other reset links and is an account event", async () => {
    const { p, token } = await personWithLink();
    expect((await ask(p.email)).status).toBe(202);
    const m = await database();
    expect(await m.AccountLink.count({ where: { userId: p.userId, usedAt: null } })).toBe(2);
    const a = await openSession(p.userId);
    const b = await openSession(p.userId);
    expect(await sessionIsOpen(a, p.userId)).toBe(true);

    expect((await reset(token, "after-reset-password")).status).toBe(200);
    expect(await sessionIsOpen(a, p.userId)).toBe(false);
    expect(await sessionIsOpen(b, p.userId)).toBe(false);
    expect(await m.AccountLink.count({ where: { userId: p.userId, usedAt: null } })).toBe(0);
    const events = await listOwnAccountEvents(p.userId);
    expect(events.find((e) => e.action === "password.reset")?.summary).toBe(
      `${p.email} set a new password with an e-mailed reset link; every session was signed out`,
    );
    await waitForMailWithSubject(stack.mailboxUrl, p.email, "Your Morphokin password was reset");
  });

  it("is rate-limited per account like sign-in (429 with Retry-After after 5 requests)", async () => {
    const p = await makePerson("scientist", w.labId, "limited");
    // RATE_LIMIT_PASSWORD_RESET_PER_ACCOUNT defaults to 5 (lib/server/config-env.ts).
    for (let i = 0; i < 5; i++) expect((await ask(p.email, `10.8.0.${i}`)).status).toBe(202);
    const over = await ask(p.email, "10.8.0.99");
    expect(over.status).toBe(429);
    expect(Number(over.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await errorOf(over)).message).toMatch(
      /^too many password reset requests for this account \(at most 5 in 15 minutes\); try again in \d+ minutes?$/,
    );
  });
});
