/**
 * Bad input and failures (accounts, invitations and members): each gets a clear message and the right status, and nothing is
 * half-written (no row without its object, no object without its row).
 * Expected statuses and messages are the product's own rules (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { authOptions } from "@/lib/server/accounts/auth";
import { database } from "@/lib/server/services";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { call } from "../support/api";
import { setupLabApi } from "../support/lab-api";

const lab = setupLabApi();
const R = (k: string) => lab.route(k);
const errorOf = async (res: Response) => ((await res.json()) as { error: { code: string; message: string } }).error;

describe("accounts", () => {
  it("rejects a wrong password (the credentials provider returns no user)", async () => {
    const provider = authOptions().providers.find((p) => p.id === "credentials") as unknown as {
      options: { authorize: (c: unknown) => Promise<unknown> };
    };
    expect(
      await provider.options.authorize({ email: lab.w.people.manager.email, password: "not-the-password" }),
    ).toBeNull();
    expect(
      await provider.options.authorize({ email: lab.w.people.manager.email, password: "long-enough-pw" }),
    ).toMatchObject({ email: lab.w.people.manager.email });
  });

  // Changed by issue 10, item 9 (no account enumeration): a taken address is no longer a 409 that
  // names it; it answers like a new one, and the mail says the rest (tests/api/auth-signup.test.ts).
  it("a duplicate e-mail at sign-up answers like a new one (202, check your e-mail)", async () => {
    const res = await call(R("POST /api/v1/signup"), "POST", "/api/v1/signup", {
      json: {
        name: "X",
        email: lab.w.people.manager.email.toUpperCase(),
        password: "long-enough-pw",
        labName: "Dup Lab",
      },
    });
    expect(res.status).toBe(202);
    expect(await res.json()).toEqual({
      status: "check-email",
      email: lab.w.people.manager.email,
      message: `Check your e-mail: a message to ${lab.w.people.manager.email} tells you how to go on.`,
    });
  });

  it("a short password and a bad e-mail are 400 with both fields named", async () => {
    const res = await call(R("POST /api/v1/signup"), "POST", "/api/v1/signup", {
      json: { name: "X", email: "nope", password: "short", labName: "L" },
    });
    expect(res.status).toBe(400);
    const e = await errorOf(res);
    expect(e.message).toContain("E-mail: enter a valid e-mail address");
    expect(e.message).toContain("Password: at least 10 characters");
    expect(e.message).toContain("Lab name: at least 2 characters");
  });

  it("malformed JSON is a 400 that says so", async () => {
    const res = await call(R("POST /api/v1/labs/[labId]/studies"), "POST", "/api/v1/labs/[labId]/studies", {
      token: lab.w.people.scientist.token,
      params: { labId: lab.w.labId },
      body: "{not json",
      headers: { "content-type": "application/json" },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toBe("the request body is not valid JSON");
  });

  it("an unknown or revoked API token is a 401", async () => {
    const res = await call(R("GET /api/v1/me"), "GET", "/api/v1/me", { token: "mk_unknown" });
    expect(res.status).toBe(401);
    expect((await errorOf(res)).message).toBe("that API token is unknown or revoked");
  });
});

describe("invitations", () => {
  const make = async (o: { expired?: boolean } = {}) => {
    const m = await database();
    const token = newSecret("inv");
    await m.Invitation.create({
      labId: lab.w.labId,
      email: `i${Math.random().toString(36).slice(2)}@lab.test`,
      role: "modeller",
      tokenHash: sha256Hex(token),
      invitedBy: lab.w.people.manager.userId,
      expiresAt: new Date(Date.now() + (o.expired ? -1000 : 86_400_000)),
    });
    return token;
  };
  const accept = (token: string) =>
    call(R("POST /api/v1/invitations/[token]/accept"), "POST", "/api/v1/invitations/[token]/accept", {
      params: { token },
      json: { name: "New Person", password: "long-enough-pw" },
    });

  it("works once; a reused link is a 409 that says it was used", async () => {
    const token = await make();
    expect((await accept(token)).status).toBe(200);
    const again = await accept(token);
    expect(again.status).toBe(409);
    expect((await errorOf(again)).message).toBe("this invitation was already used; sign in instead");
  });

  it("an expired link is a 409 that says it expired, and creates no user", async () => {
    const m = await database();
    const before = await m.User.count();
    const res = await accept(await make({ expired: true }));
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe("this invitation has expired; ask the lab manager for a new one");
    expect(await m.User.count()).toBe(before);
  });

  it("a made-up token is a 404", async () => {
    expect((await accept("inv_madeup")).status).toBe(404);
  });

  it("inviting an existing member is a 409", async () => {
    const res = await call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
      token: lab.w.people.manager.token,
      params: { labId: lab.w.labId },
      json: { email: lab.w.people.scientist.email, role: "modeller" },
    });
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe(`${lab.w.people.scientist.email} is already a member of this lab`);
  });

  it("the invitation e-mail arrives in the fake mailbox with a working link", async () => {
    const email = `mailed${Date.now()}@lab.test`;
    const res = await call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
      token: lab.w.people.manager.token,
      params: { labId: lab.w.labId },
      json: { email, role: "collaborator" },
    });
    expect(res.status).toBe(201);
    const mail = (await (await fetch(`${lab.stack.mailboxUrl}/messages?to=${email}`)).json()) as {
      messages: { text: string }[];
    };
    expect(mail.messages).toHaveLength(1);
    const token = /\/invite\/(\S+)/.exec(mail.messages[0].text)![1];
    expect((await accept(token)).status).toBe(200);
  });

  it("a lab's development mailbox shows its invitees' mail and not another lab's", async () => {
    const ours = `ours${Date.now()}@lab.test`,
      theirs = `theirs${Date.now()}@lab.test`;
    const invite = (labId: string, token: string, email: string) =>
      call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
        token,
        params: { labId },
        json: { email, role: "collaborator" },
      });
    expect((await invite(lab.w.labId, lab.w.people.manager.token, ours)).status).toBe(201);
    expect((await invite(lab.w.otherLabId, lab.w.outsider.token, theirs)).status).toBe(201);
    const box = async (labId: string, token: string) => {
      const res = await call(R("GET /api/v1/labs/[labId]/mailbox"), "GET", "/api/v1/labs/[labId]/mailbox", {
        token,
        params: { labId },
      });
      return ((await res.json()) as { items: { to: string[] }[] }).items.flatMap((x) => x.to);
    };
    const mine = await box(lab.w.labId, lab.w.people.manager.token),
      other = await box(lab.w.otherLabId, lab.w.outsider.token);
    expect(mine).toContain(ours);
    expect(mine).not.toContain(theirs);
    expect(other).toContain(theirs);
    expect(other).not.toContain(ours);
  });
});

describe("members", () => {
  it("the last lab manager can neither be demoted nor removed", async () => {
    const m = await database();
    const me = await m.Membership.findOne({ where: { labId: lab.w.labId, userId: lab.w.people.manager.userId } });
    const patch = await call(
      R("PATCH /api/v1/labs/[labId]/members/[memberId]"),
      "PATCH",
      "/api/v1/labs/[labId]/members/[memberId]",
      {
        token: lab.w.people.manager.token,
        params: { labId: lab.w.labId, memberId: me!.id },
        json: { role: "scientist" },
      },
    );
    expect(patch.status).toBe(409);
    expect((await errorOf(patch)).message).toBe(
      "a lab must keep at least one lab manager: make someone else lab manager first",
    );
    const del = await call(
      R("DELETE /api/v1/labs/[labId]/members/[memberId]"),
      "DELETE",
      "/api/v1/labs/[labId]/members/[memberId]",
      { token: lab.w.people.manager.token, params: { labId: lab.w.labId, memberId: me!.id } },
    );
    expect(del.status).toBe(409);
    expect((await m.Membership.findByPk(me!.id))!.role).toBe("manager");
  });

  it("a role change is in the audit trail with who, what and when", async () => {
    const m = await database();
    const ms = await m.Membership.findOne({ where: { labId: lab.w.labId, userId: lab.w.people.modeller.userId } });
    await call(R("PATCH /api/v1/labs/[labId]/members/[memberId]"), "PATCH", "/api/v1/labs/[labId]/members/[memberId]", {
      token: lab.w.people.manager.token,
      params: { labId: lab.w.labId, memberId: ms!.id },
      json: { role: "collaborator" },
    });
    const res = await call(R("GET /api/v1/labs/[labId]/audit"), "GET", "/api/v1/labs/[labId]/audit", {
      token: lab.w.people.manager.token,
      params: { labId: lab.w.labId },
      query: "q=role_changed",
    });
    const body = (await res.json()) as { items: { actorEmail: string; summary: string; at: string }[] };
    expect(body.items[0].actorEmail).toBe(lab.w.people.manager.email);
    expect(body.items[0].summary).toBe(
      `${lab.w.people.manager.email} changed ${lab.w.people.modeller.email} from Modeller to Collaborator`,
    );
    expect(Date.now() - Date.parse(body.items[0].at)).toBeLessThan(60_000);
  });
});
