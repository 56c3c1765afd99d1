/**
 * Account-level audit events: sign-ins (success, failure, lockout) through `recordSignIn`, API
 * token creation and revocation through the routes, and where they are shown (the account's own
 * list; the lab managers' list of their members).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listMemberAccountEvents, listOwnAccountEvents, recordSignIn } from "@/lib/server/audit";
import { database } from "@/lib/server/services";
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

const managerCtx = () => ({
  actor: w.people.manager.actor,
  labId: w.labId,
  labName: "Test Lab",
  role: "manager" as const,
});

describe("sign-in events", () => {
  it("records success, failure and lockout for the account, shown to it and to its lab's managers", async () => {
    const who = w.people.modeller;
    await recordSignIn({ outcome: "succeeded", email: who.email, method: "password", ip: "127.0.0.1" });
    await recordSignIn({
      outcome: "failed",
      email: who.email.toUpperCase(),
      method: "password",
      reason: "wrong password",
    });
    const until = new Date(Date.UTC(2031, 0, 2, 3, 4, 5));
    await recordSignIn({ outcome: "locked", email: who.email, method: "password", lockedUntil: until });
    const own = await listOwnAccountEvents(who.userId);
    expect(own.map((e) => e.action)).toEqual(
      expect.arrayContaining(["signin.succeeded", "signin.failed", "signin.locked"]),
    );
    expect(own.find((e) => e.action === "signin.succeeded")!.summary).toBe(
      `${who.email} signed in with password from 127.0.0.1`,
    );
    expect(own.find((e) => e.action === "signin.failed")!.summary).toBe(
      `Failed sign-in as ${who.email} with password: wrong password`,
    );
    expect(own.find((e) => e.action === "signin.locked")!.summary).toBe(
      `${who.email} was locked out after repeated failed sign-ins with password, until 2031-01-02T03:04:05Z`,
    );
    const members = await listMemberAccountEvents(managerCtx());
    expect(members.filter((e) => e.email === who.email).map((e) => e.action)).toEqual(
      expect.arrayContaining(["signin.succeeded", "signin.failed", "signin.locked"]),
    );
  });

  it("a failed sign-in with an unknown address is kept without an account and shown to no lab", async () => {
    await recordSignIn({
      outcome: "failed",
      email: "nobody-here@lab.test",
      method: "password",
      reason: "unknown address",
    });
    const m = await database();
    const row = await m.AccountEvent.findOne({ where: { email: "nobody-here@lab.test" } });
    expect(row).toMatchObject({ userId: null, action: "signin.failed" });
    expect((await listMemberAccountEvents(managerCtx())).some((e) => e.email === "nobody-here@lab.test")).toBe(false);
  });

  it("another lab's manager does not see this lab's members' sign-ins", async () => {
    await recordSignIn({ outcome: "succeeded", email: w.people.collaborator.email, method: "email link" });
    const other = { actor: w.outsider.actor, labId: w.otherLabId, labName: "Other", role: "manager" as const };
    expect((await listMemberAccountEvents(other)).some((e) => e.email === w.people.collaborator.email)).toBe(false);
  });

  it("only managers read the members' account events", async () => {
    const scientist = {
      actor: w.people.scientist.actor,
      labId: w.labId,
      labName: "Test Lab",
      role: "scientist" as const,
    };
    await expect(listMemberAccountEvents(scientist)).rejects.toThrow();
  });
});

describe("API token events", () => {
  it("creation and revocation are recorded with the token's name and prefix", async () => {
    const who = w.people.scientist;
    const created = await call(routes.get("POST /api/v1/tokens")!, "POST", "/api/v1/tokens", {
      token: who.token,
      json: { name: "nightly batch" },
    });
    expect(created.status).toBe(201);
    const t = (await created.json()) as { id: string; prefix: string; expiresAt: string };
    const revoked = await call(routes.get("DELETE /api/v1/tokens/[tokenId]")!, "DELETE", "/api/v1/tokens/[tokenId]", {
      token: who.token,
      params: { tokenId: t.id },
    });
    expect(revoked.status).toBe(204);
    const own = await listOwnAccountEvents(who.userId);
    expect(own.find((e) => e.action === "token.created")!.summary).toBe(
      `${who.email} created the API token “nightly batch” (${t.prefix}…), expiring on ${t.expiresAt.slice(0, 10)}`,
    );
    expect(own.find((e) => e.action === "token.revoked")!.summary).toBe(
      `${who.email} revoked the API token “nightly batch” (${t.prefix}…)`,
    );
    expect(
      (await listMemberAccountEvents(managerCtx())).filter((e) => e.email === who.email).map((e) => e.action),
    ).toEqual(expect.arrayContaining(["token.created", "token.revoked"]));
  });
});
