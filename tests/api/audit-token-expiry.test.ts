/**
 * API tokens expire: 90 days by default, 30 or 365 when chosen, shown in the list; an expired
 * token answers 401 "that API token expired on …", and its expiry is written to the audit trail
 * exactly once (on use, on listing, or by the start-up sweep).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listOwnAccountEvents } from "@/lib/server/audit";
import { recordExpiredTokens } from "@/lib/server/accounts/tokens";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
const DAY_MS = 86_400_000;

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

const create = (token: string, json: unknown) =>
  call(routes.get("POST /api/v1/tokens")!, "POST", "/api/v1/tokens", { token, json });
const me = (token: string) => call(routes.get("GET /api/v1/me")!, "GET", "/api/v1/me", { token });

describe("API token expiry", () => {
  it("a new token expires after 90 days by default, or after 30 or 365 days when chosen", async () => {
    for (const [json, days] of [
      [{ name: "default" }, 90],
      [{ name: "month", expiresInDays: 30 }, 30],
      [{ name: "year", expiresInDays: 365 }, 365],
    ] as const) {
      const before = Date.now();
      const res = await create(w.people.modeller.token, json);
      expect(res.status).toBe(201);
      const t = (await res.json()) as { expiresAt: string; expired: boolean };
      const ms = Date.parse(t.expiresAt) - before;
      expect(ms).toBeGreaterThanOrEqual(days * DAY_MS - 1000);
      expect(ms).toBeLessThanOrEqual(days * DAY_MS + 60_000);
      expect(t.expired).toBe(false);
    }
    const list = (await (
      await call(routes.get("GET /api/v1/tokens")!, "GET", "/api/v1/tokens", { token: w.people.modeller.token })
    ).json()) as { items: { name: string; expiresAt: string | null }[] };
    expect(list.items.find((t) => t.name === "year")!.expiresAt).not.toBeNull();
  });

  it("refuses another lifetime, naming the field as the form does", async () => {
    const res = await create(w.people.modeller.token, { name: "forever", expiresInDays: 10_000 });
    expect(res.status).toBe(400);
    expect(JSON.stringify(await res.json())).toContain("“Expires after” must be 30, 90 or 365 days");
  });

  it("an expired token answers 401 with its expiry date, and the expiry is recorded once", async () => {
    const who = w.people.collaborator;
    const res = await create(who.token, { name: "short-lived", expiresInDays: 30 });
    const t = (await res.json()) as { id: string; secret: string };
    expect((await me(t.secret)).status).toBe(200);
    const m = await database();
    const expiredAt = new Date(Date.UTC(2026, 0, 15, 12, 0, 0));
    await m.ApiToken.update({ expiresAt: expiredAt }, { where: { id: t.id } });
    for (let i = 0; i < 2; i++) {
      const r = await me(t.secret);
      expect(r.status).toBe(401);
      expect(((await r.json()) as { error: { message: string } }).error.message).toBe(
        "that API token expired on 2026-01-15; create a new one on your account page",
      );
    }
    await recordExpiredTokens();
    const expiries = (await listOwnAccountEvents(who.userId)).filter((e) => e.action === "token.expired");
    expect(expiries).toHaveLength(1);
    expect(expiries[0].summary).toBe(
      `The API token “short-lived” (${(await m.ApiToken.findByPk(t.id))!.prefix}…) of ${who.email} expired on 2026-01-15`,
    );
  });

  it("a token that expired unused is recorded by the sweep, once", async () => {
    const who = w.people.scientist;
    const t = (await (await create(who.token, { name: "never used" })).json()) as { id: string };
    const m = await database();
    await m.ApiToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: t.id } });
    await recordExpiredTokens();
    await recordExpiredTokens();
    const rows = await m.AccountEvent.findAll({ where: { action: "token.expired", userId: who.userId } });
    expect(rows.filter((r) => (r.details as { tokenId: string }).tokenId === t.id)).toHaveLength(1);
  });

  it("a revoked token that passes its expiry date is not recorded as expired", async () => {
    const who = w.people.manager;
    const t = (await (await create(who.token, { name: "revoked first" })).json()) as { id: string };
    await call(routes.get("DELETE /api/v1/tokens/[tokenId]")!, "DELETE", "/api/v1/tokens/[tokenId]", {
      token: who.token,
      params: { tokenId: t.id },
    });
    const m = await database();
    await m.ApiToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: t.id } });
    await recordExpiredTokens();
    expect(await m.AccountEvent.count({ where: { action: "token.expired", userId: who.userId } })).toBe(0);
  });
});
