/**
 * The development mailbox cannot be used to take over an account (issue 10, item 1): a lab sees
 * mail to its current members and pending invitations only, never a sign-in link of someone who
 * belongs to another lab, and the mailbox is on only in a local development setup.
 * Expected behaviour: the rules (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authOptions } from "@/lib/server/accounts/auth";
import { mailboxEnabled } from "@/lib/server/labs/mailbox";
import { call, discoverRoutes } from "../support/api";
import { listMail, waitForMailWithSubject } from "../support/mail";
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

const invite = (labId: string, token: string, email: string) =>
  call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
    token,
    params: { labId },
    json: { email, role: "collaborator" },
  });
const mailbox = async (labId: string, token: string) => {
  const res = await call(R("GET /api/v1/labs/[labId]/mailbox"), "GET", "/api/v1/labs/[labId]/mailbox", {
    token,
    params: { labId },
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { items: { to: string[]; subject: string; text: string }[] }).items;
};

/** What next-auth does for "E-mail me a sign-in link" (its e-mail provider's send step). */
async function requestSignInLink(email: string) {
  const provider = authOptions().providers.find((p) => p.id === "email") as unknown as {
    options: { sendVerificationRequest: (x: { identifier: string; url: string }) => Promise<void> };
  };
  await provider.options.sendVerificationRequest({
    identifier: email,
    url: `http://127.0.0.1:3999/api/auth/callback/email?token=t${Date.now()}&email=${encodeURIComponent(email)}`,
  });
  // The mail leaves off the request path: wait for this very message before looking at the mailbox.
  return waitForMailWithSubject(stack.mailboxUrl, email, "Your Morphokin sign-in link");
}

describe("development mailbox", () => {
  it("does not show another lab's manager's sign-in link after inviting and revoking them (the takeover)", async () => {
    const victim = w.outsider.email; // manager of the other lab
    const attacker = w.people.manager;
    expect((await invite(w.labId, attacker.token, victim)).status).toBe(201);
    const list = await call(R("GET /api/v1/labs/[labId]/invitations"), "GET", "/api/v1/labs/[labId]/invitations", {
      token: attacker.token,
      params: { labId: w.labId },
    });
    const inv = ((await list.json()) as { items: { id: string; email: string }[] }).items.find(
      (i) => i.email === victim,
    )!;
    expect(
      (
        await call(
          R("DELETE /api/v1/labs/[labId]/invitations/[invitationId]"),
          "DELETE",
          "/api/v1/labs/[labId]/invitations/[invitationId]",
          { token: attacker.token, params: { labId: w.labId, invitationId: inv.id } },
        )
      ).status,
    ).toBe(204);

    const link = await requestSignInLink(victim);
    expect(link.text).toContain("/api/auth/callback/email");
    const seen = await mailbox(w.labId, attacker.token);
    expect(seen.flatMap((m) => m.to)).not.toContain(victim);
    expect(seen.some((m) => m.text.includes("/api/auth/callback/email"))).toBe(false);
    // The victim's own lab still sees it (their own mailbox).
    expect(
      (await mailbox(w.otherLabId, w.outsider.token)).some((m) => m.subject === "Your Morphokin sign-in link"),
    ).toBe(true);
  });

  it("shows a pending invitation to another lab's member but not their sign-in link", async () => {
    const other = `two-labs-${Date.now()}@lab.test`;
    expect((await invite(w.otherLabId, w.outsider.token, other)).status).toBe(201);
    // They join the other lab …
    const mail = await waitForMailWithSubject(stack.mailboxUrl, other, "You are invited to Other Lab on Morphokin");
    const token = /\/invite\/(\S+)/.exec(mail.text)![1];
    expect(
      (
        await call(R("POST /api/v1/invitations/[token]/accept"), "POST", "/api/v1/invitations/[token]/accept", {
          params: { token },
          json: { name: "Two Labs", password: "long-enough-pw" },
        })
      ).status,
    ).toBe(200);
    // … and this lab invites them too, and asks for their sign-in link.
    expect((await invite(w.labId, w.people.manager.token, other)).status).toBe(201);
    await requestSignInLink(other);
    const seen = (await mailbox(w.labId, w.people.manager.token)).filter((m) => m.to.includes(other));
    expect(seen.map((m) => m.subject)).toEqual(["You are invited to Test Lab on Morphokin"]);
  });

  it("shows no mail to an address whose invitation was revoked", async () => {
    const gone = `revoked-${Date.now()}@lab.test`;
    expect((await invite(w.labId, w.people.manager.token, gone)).status).toBe(201);
    await waitForMailWithSubject(stack.mailboxUrl, gone, "You are invited to Test Lab on Morphokin");
    expect((await mailbox(w.labId, w.people.manager.token)).flatMap((m) => m.to)).toContain(gone);
    const list = await call(R("GET /api/v1/labs/[labId]/invitations"), "GET", "/api/v1/labs/[labId]/invitations", {
      token: w.people.manager.token,
      params: { labId: w.labId },
    });
    const inv = ((await list.json()) as { items: { id: string; email: string }[] }).items.find(
      (i) => i.email === gone,
    )!;
    await call(
      R("DELETE /api/v1/labs/[labId]/invitations/[invitationId]"),
      "DELETE",
      "/api/v1/labs/[labId]/invitations/[invitationId]",
      { token: w.people.manager.token, params: { labId: w.labId, invitationId: inv.id } },
    );
    expect((await listMail(stack.mailboxUrl, gone)).length).toBe(1);
    expect((await mailbox(w.labId, w.people.manager.token)).flatMap((m) => m.to)).not.toContain(gone);
  });

  it("is on only in a local development setup (loopback URLs; a production build needs MORPHOKIN_DEV_MAILBOX=1)", () => {
    const config = stack.services.config;
    const saved = { ...config };
    try {
      expect(mailboxEnabled()).toBe(true);
      Object.assign(config, { appUrl: "https://morphokin.example.org" });
      expect(mailboxEnabled()).toBe(false);
      Object.assign(config, { appUrl: saved.appUrl, devMailboxUrl: "http://mail.example.org:2526" });
      expect(mailboxEnabled()).toBe(false);
      Object.assign(config, { devMailboxUrl: saved.devMailboxUrl, productionBuild: true, devMailboxOptIn: false });
      expect(mailboxEnabled()).toBe(false);
      Object.assign(config, { devMailboxOptIn: true });
      expect(mailboxEnabled()).toBe(true);
      Object.assign(config, { devMailboxUrl: "" });
      expect(mailboxEnabled()).toBe(false);
    } finally {
      Object.assign(config, saved);
    }
  });
});
