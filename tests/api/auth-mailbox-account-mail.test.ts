/**
 * The development mailbox cannot be used to take over a member's account (issue 16, Accounts): a
 * password reset, an e-mail change (link and notices) and a sign-in link of a member of this lab
 * only are never shown to the lab's manager there; the manager's own account mail still is.
 * Expected behaviour: the rules (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authOptions } from "@/lib/server/accounts/auth";
import { hashPassword } from "@/lib/server/accounts/passwords";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { waitForMailWithSubject } from "../support/mail";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
const R = (k: string) => routes.get(k)!;

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

const mailbox = async (token: string) => {
  const res = await call(R("GET /api/v1/labs/[labId]/mailbox"), "GET", "/api/v1/labs/[labId]/mailbox", {
    token,
    params: { labId: w.labId },
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { items: { to: string[]; subject: string; text: string }[] }).items;
};
const askReset = (email: string) =>
  call(R("POST /api/v1/password-reset"), "POST", "/api/v1/password-reset", { json: { email } });

describe("development mailbox and account mail", () => {
  it("never shows a member's reset, e-mail change or sign-in link mail to the lab manager", async () => {
    const victim = w.people.scientist; // a member of this lab only: the manager sees their lab mail
    const m = await database();
    await m.User.update({ passwordHash: await hashPassword("long-enough-pw") }, { where: { id: victim.userId } });

    expect((await askReset(victim.email)).status).toBe(202);
    await waitForMailWithSubject(stack.mailboxUrl, victim.email, "Reset your Morphokin password");

    const newEmail = `elsewhere-${Date.now()}@lab.test`;
    const change = await call(R("POST /api/v1/me/email"), "POST", "/api/v1/me/email", {
      token: victim.token,
      json: { newEmail, currentPassword: "long-enough-pw" },
    });
    expect(change.status).toBe(202);
    await waitForMailWithSubject(stack.mailboxUrl, victim.email, "Your Morphokin e-mail address is about to change");
    await waitForMailWithSubject(stack.mailboxUrl, newEmail, "Confirm your new e-mail address for Morphokin");

    const provider = authOptions().providers.find((p) => p.id === "email") as unknown as {
      options: { sendVerificationRequest: (x: { identifier: string; url: string }) => Promise<void> };
    };
    await provider.options.sendVerificationRequest({
      identifier: victim.email,
      url: `http://127.0.0.1:3999/api/auth/callback/email?token=t${Date.now()}&email=${encodeURIComponent(victim.email)}`,
    });
    await waitForMailWithSubject(stack.mailboxUrl, victim.email, "Your Morphokin sign-in link");

    const seen = await mailbox(w.people.manager.token);
    const leaked = seen.filter(
      (x) =>
        x.to.includes(victim.email) ||
        x.to.includes(newEmail) ||
        /\/reset-password\/|\/confirm-email\/|\/api\/auth\//.test(x.text),
    );
    expect(leaked.map((x) => x.subject)).toEqual([]);
  });

  it("still shows the lab's ordinary mail to a member, and the manager's own reset mail to the manager", async () => {
    const invitee = `invitee-${Date.now()}@lab.test`;
    const inv = await call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
      token: w.people.manager.token,
      params: { labId: w.labId },
      json: { email: invitee, role: "collaborator" },
    });
    expect(inv.status).toBe(201);
    await waitForMailWithSubject(stack.mailboxUrl, invitee, "You are invited to Test Lab on Morphokin");
    const own = w.people.manager.email;
    expect((await askReset(own)).status).toBe(202);
    await waitForMailWithSubject(stack.mailboxUrl, own, "Reset your Morphokin password");

    const subjects = (await mailbox(w.people.manager.token)).map((x) => x.subject);
    expect(subjects).toContain("You are invited to Test Lab on Morphokin");
    expect(subjects).toContain("Reset your Morphokin password");
  });
});
