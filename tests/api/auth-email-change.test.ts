/**
 * Display name and e-mail address (issue 16, Accounts): a new address takes effect only through the
 * link mailed to it, the old address is told at once and stays until then; both changes and the
 * password change are account events (API token events: tests/api/audit-account-events.test.ts).
 * Expected behaviour: the rules (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hashPassword } from "@/lib/server/accounts/passwords";
import { listMemberAccountEvents, listOwnAccountEvents } from "@/lib/server/audit";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { listMail, waitForMailWithSubject } from "../support/mail";
import { startTestStack, type TestStack } from "../support/stack";
import { makePerson, makeWorld, type Person, type World } from "../support/world";

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

const errorOf = async (res: Response) => ((await res.json()) as { error: { message: string } }).error;
const me = async (p: Person) =>
  (await (await call(R("GET /api/v1/me"), "GET", "/api/v1/me", { token: p.token })).json()) as {
    email: string;
    name: string;
  };
const askChange = (p: Person, newEmail: string, currentPassword = "long-enough-pw") =>
  call(R("POST /api/v1/me/email"), "POST", "/api/v1/me/email", { token: p.token, json: { newEmail, currentPassword } });
const confirm = (token: string) =>
  call(R("POST /api/v1/email-change/confirm"), "POST", "/api/v1/email-change/confirm", { json: { token } });

async function personWithPassword(): Promise<Person> {
  const p = await makePerson("modeller", w.labId, `mv${++n}`);
  const m = await database();
  await m.User.update({ passwordHash: await hashPassword("long-enough-pw") }, { where: { id: p.userId } });
  return p;
}

describe("e-mail change", () => {
  it("mails a link to the new address and a notice to the old; the old address stays until the link is opened, once", async () => {
    const p = await personWithPassword();
    const newEmail = `new-home-${Date.now()}@lab.test`;
    const res = await askChange(p, newEmail);
    expect(res.status).toBe(202);
    expect((await res.json()).message).toBe(
      `We sent a link to ${newEmail}. Open it to finish; until then your address stays ${p.email}.`,
    );
    const link = await waitForMailWithSubject(
      stack.mailboxUrl,
      newEmail,
      "Confirm your new e-mail address for Morphokin",
    );
    expect(link.text).toContain("expires in 24 hours");
    const notice = await waitForMailWithSubject(
      stack.mailboxUrl,
      p.email,
      "Your Morphokin e-mail address is about to change",
    );
    expect(notice.text).not.toContain("/confirm-email/"); // the old address cannot confirm it
    expect((await me(p)).email).toBe(p.email);

    const token = /\/confirm-email\/(\S+)/.exec(link.text)![1];
    expect((await confirm(token)).status).toBe(200);
    expect((await me(p)).email).toBe(newEmail);
    await waitForMailWithSubject(stack.mailboxUrl, p.email, "Your Morphokin e-mail address was changed");

    const again = await confirm(token);
    expect(again.status).toBe(409);
    expect((await errorOf(again)).message).toBe(
      "this link to confirm your new e-mail address was already used; change the address again on your Account page",
    );
    const events = await listOwnAccountEvents(p.userId);
    expect(events.map((e) => e.action)).toEqual(expect.arrayContaining(["email.change-requested", "email.changed"]));
    expect(events.find((e) => e.action === "email.changed")!.summary).toBe(
      `${p.email} changed their e-mail address to ${newEmail} (confirmed by the link sent there)`,
    );
  });

  it("needs the current password, and refuses an expired link leaving the address as it was", async () => {
    const p = await personWithPassword();
    const wrong = await askChange(p, `x-${Date.now()}@lab.test`, "not-my-password");
    expect(wrong.status).toBe(401);
    expect((await errorOf(wrong)).message).toBe("current password: that is not your current password");

    const newEmail = `late-${Date.now()}@lab.test`;
    expect((await askChange(p, newEmail)).status).toBe(202);
    const link = await waitForMailWithSubject(
      stack.mailboxUrl,
      newEmail,
      "Confirm your new e-mail address for Morphokin",
    );
    const m = await database();
    await m.AccountLink.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: p.userId } });
    const res = await confirm(/\/confirm-email\/(\S+)/.exec(link.text)![1]);
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe(
      "this link to confirm your new e-mail address has expired; change the address again on your Account page",
    );
    expect((await me(p)).email).toBe(p.email);
  });

  it("answers the same for an address that has an account, which gets a note and no link", async () => {
    const p = await personWithPassword();
    const taken = w.people.collaborator.email;
    const res = await askChange(p, taken);
    expect(res.status).toBe(202);
    await waitForMailWithSubject(stack.mailboxUrl, taken, "Someone tried to move a Morphokin account to this address");
    expect((await listMail(stack.mailboxUrl, taken)).some((x) => x.text.includes("/confirm-email/"))).toBe(false);
    expect((await me(p)).email).toBe(p.email);
  });
});

describe("display name and password events", () => {
  it("changes the display name (PATCH /me) and records from and to", async () => {
    const p = await personWithPassword();
    const before = (await me(p)).name;
    const res = await call(R("PATCH /api/v1/me"), "PATCH", "/api/v1/me", {
      token: p.token,
      json: { name: "Ira Fenwick" },
    });
    expect(res.status).toBe(200);
    expect((await res.json()).name).toBe("Ira Fenwick");
    const e = (await listOwnAccountEvents(p.userId)).find((x) => x.action === "name.changed");
    expect(e?.summary).toBe(`${p.email} changed their display name from “${before}” to “Ira Fenwick”`);
    const empty = await call(R("PATCH /api/v1/me"), "PATCH", "/api/v1/me", { token: p.token, json: { name: "  " } });
    expect(empty.status).toBe(400);
    expect((await errorOf(empty)).message).toBe("Name: enter the name others should see");
  });

  it("a password change is an account event the lab's managers see too", async () => {
    const p = await personWithPassword();
    const res = await call(R("POST /api/v1/me/password"), "POST", "/api/v1/me/password", {
      token: p.token,
      json: { currentPassword: "long-enough-pw", newPassword: "another-long-password" },
    });
    expect(res.status).toBe(200);
    const ctx = { actor: w.people.manager.actor, labId: w.labId, labName: "Test Lab", role: "manager" as const };
    const seen = (await listMemberAccountEvents(ctx)).filter((e) => e.email === p.email);
    expect(seen.map((e) => e.action)).toContain("password.changed");
  });
});
