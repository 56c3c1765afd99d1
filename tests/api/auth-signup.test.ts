/**
 * No account enumeration (issue 10, item 9): sign-up, the sign-in link request and password
 * sign-in answer the same, after the same work, for an address with and without an account.
 * Timing checks compare medians of a few runs with a wide margin (factor 3 + 100 ms; common
 * practice, no source) and are backed by checks of the work itself (bcrypt compares, mail sent).
 */
import bcrypt from "bcryptjs";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { authOptions, checkPassword } from "@/lib/server/accounts/auth";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { listMail, waitForMailWithSubject } from "../support/mail";
import { startTestStack, type TestStack } from "../support/stack";
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

const signup = (email: string, password = "long-enough-pw") =>
  call(R("POST /api/v1/signup"), "POST", "/api/v1/signup", {
    json: { name: "Ada Quill", email, password, labName: "Quill Lab" },
    headers: { "x-forwarded-for": `10.0.0.${++n % 250}` },
  });
const confirm = (token: string, password: string) =>
  call(R("POST /api/v1/signup/confirm"), "POST", "/api/v1/signup/confirm", { json: { token, password } });

async function median(f: () => Promise<unknown>, runs = 5): Promise<number> {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await f();
    times.push(performance.now() - t0);
  }
  return times.sort((a, b) => a - b)[Math.floor(runs / 2)];
}
const similar = (a: number, b: number) => Math.max(a, b) <= 3 * Math.min(a, b) + 100;

describe("sign-up", () => {
  it("answers a new and a taken address with the same status and body (the address only), in about the same time", async () => {
    const fresh = `fresh-${Date.now()}@lab.test`;
    const a = await signup(fresh);
    const b = await signup(w.people.manager.email);
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    const [ja, jb] = [await a.json(), await b.json()];
    expect({ ...ja, email: "x", message: ja.message.replace(fresh, "x") }).toEqual({
      ...jb,
      email: "x",
      message: jb.message.replace(w.people.manager.email, "x"),
    });
    // … and about the same time (this part alone held before: both paths hashed the password).
    const tNew = await median(() => signup(`timing-${Date.now()}-${++n}@lab.test`));
    const tOld = await median(() => signup(w.outsider.email));
    expect(similar(tNew, tOld), `new ${tNew.toFixed(0)} ms vs taken ${tOld.toFixed(0)} ms`).toBe(true);
  });

  it("creates the account and its lab only when the e-mailed link is opened with the chosen password, once", async () => {
    const m = await database();
    const email = `confirm-${Date.now()}@lab.test`;
    expect((await signup(email, "my-chosen-password")).status).toBe(202);
    expect(await m.User.count({ where: { email } })).toBe(0);
    const mail = await waitForMailWithSubject(stack.mailboxUrl, email, "Confirm your Morphokin account");
    const token = /\/signup\/confirm\/(\S+)/.exec(mail.text)![1];

    const wrong = await confirm(token, "not-my-password");
    expect(wrong.status).toBe(401);
    expect((await wrong.json()).error.message).toBe("password: this is not the password you chose when you signed up");
    expect(await m.User.count({ where: { email } })).toBe(0);

    const ok = await confirm(token, "my-chosen-password");
    expect(ok.status).toBe(201);
    const { labId } = (await ok.json()) as { labId: string };
    const user = await m.User.findOne({ where: { email } });
    expect(user?.emailVerified).not.toBeNull();
    expect(await m.Membership.findOne({ where: { labId, userId: user!.id } })).toMatchObject({ role: "manager" });
    expect(await checkPassword({ email, password: "my-chosen-password" })).toMatchObject({ email });

    const again = await confirm(token, "my-chosen-password");
    expect(again.status).toBe(409);
    expect((await again.json()).error.message).toBe("this confirmation link was already used; sign in instead");
  });

  it("mails a taken address that it has an account, with a sign-in link, and changes nothing", async () => {
    const m = await database();
    const before = await m.Lab.count();
    const email = w.people.manager.email; // has the password long-enough-pw (tests/support/world.ts)
    const seen = new Set((await listMail(stack.mailboxUrl, email)).map((x) => x.id));
    expect((await signup(email, "someone-elses-guess")).status).toBe(202);
    await expect
      .poll(
        async () => (await listMail(stack.mailboxUrl, email)).filter((x) => !seen.has(x.id!)).map((x) => x.subject),
        { timeout: 10_000 },
      )
      .toEqual(["You already have a Morphokin account"]);
    const mail = (await listMail(stack.mailboxUrl, email)).find((x) => !seen.has(x.id!))!;
    expect(mail.text).toContain("/api/auth/callback/email?");
    expect(await m.Lab.count()).toBe(before);
    expect(await checkPassword({ email, password: "long-enough-pw" })).toMatchObject({ email });
  });
});

describe("sign-in link request", () => {
  type EmailProvider = {
    options: { sendVerificationRequest: (x: { identifier: string; url: string }) => Promise<void> };
  };
  const provider = () => authOptions().providers.find((p) => p.id === "email") as unknown as EmailProvider;
  const signInCallback = (email: string) =>
    authOptions().callbacks!.signIn!({
      user: { id: email, email },
      account: { provider: "email", type: "email", providerAccountId: email },
      email: { verificationRequest: true },
    } as never);

  it("goes on to the same check-your-e-mail page for a known and an unknown address", async () => {
    expect(await signInCallback(w.people.scientist.email)).toBe(true);
    expect(await signInCallback(`nobody-${Date.now()}@lab.test`)).toBe(true);
  });

  it("takes about the same time for both (the mail leaves off the request path), and mails only the account", async () => {
    const unknown = `nobody-${Date.now()}@lab.test`;
    const send = (identifier: string) =>
      provider().options.sendVerificationRequest({
        identifier,
        url: `http://127.0.0.1:3999/api/auth/callback/email?token=t${++n}`,
      });
    const tKnown = await median(() => send(w.people.modeller.email));
    const tUnknown = await median(() => send(unknown));
    expect(similar(tKnown, tUnknown), `known ${tKnown.toFixed(0)} ms vs unknown ${tUnknown.toFixed(0)} ms`).toBe(true);
    await waitForMailWithSubject(stack.mailboxUrl, w.people.modeller.email, "Your Morphokin sign-in link");
    expect(await listMail(stack.mailboxUrl, unknown)).toEqual([]);
  });
});

describe("password sign-in", () => {
  it("does one bcrypt compare for an unknown address, as for a known one, and takes about the same time", async () => {
    const spy = vi.spyOn(bcrypt, "compare");
    try {
      await checkPassword({ email: w.people.collaborator.email, password: "wrong-password-1" });
      const known = spy.mock.calls.length;
      spy.mockClear();
      await checkPassword({ email: `nobody-${Date.now()}@lab.test`, password: "wrong-password-1" });
      expect(spy.mock.calls.length).toBe(known);
      expect(known).toBe(1);
    } finally {
      spy.mockRestore();
    }
    const tKnown = await median(() => checkPassword({ email: w.outsider.email, password: `wrong-${++n}` }), 3);
    const tUnknown = await median(() => checkPassword({ email: `nobody-${++n}@lab.test`, password: "wrong" }), 3);
    expect(similar(tKnown, tUnknown), `known ${tKnown.toFixed(0)} ms vs unknown ${tUnknown.toFixed(0)} ms`).toBe(true);
  });
});
