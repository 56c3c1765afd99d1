/**
 * Kept answers (lib/server/web/answer-cache.ts, labReadRoute): an API script's list or detail is
 * given again only while the database is unchanged, for the same token and URL, within the
 * answer's age and its token's life. Every expected body here is the API's own fresh answer or a
 * value written by the test (common practice, no source).
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { AnswerCache } from "@/lib/server/web/answer-cache";
import { labAnswers } from "@/lib/server/web/lab-route";
import { createDatabase, type ChangeMark } from "@/lib/server/db";
import { database, services } from "@/lib/server/services";
import { stopJobs } from "@/lib/server/jobs/worker";
import { setupLabApi } from "../support/lab-api";

/** A change mark at `version` with no table counted. */
const at = (version: string): ChangeMark => ({ version, tables: new Map() });

const json = (body: unknown, status = 200) =>
  new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

describe("AnswerCache", () => {
  it("gives a kept answer again only for the same mark, within its age and its validity", async () => {
    let now = 1_000_000;
    const cache = new AnswerCache({ maxAgeMs: 1000, now: () => now });
    let n = 0;
    const make = async () => ({ response: json({ n: ++n }), validUntil: 1_000_600 });
    const body = async (r: Promise<Response>) => (await r).json();
    expect(await body(cache.answer("k", at("1.0"), make))).toEqual({ n: 1 });
    expect(await body(cache.answer("k", at("1.0"), make))).toEqual({ n: 1 }); // given again
    expect(await body(cache.answer("other", at("1.0"), make))).toEqual({ n: 2 }); // another key
    expect(await body(cache.answer("k", at("2.0"), make))).toEqual({ n: 3 }); // the database changed
    now += 599;
    expect(await body(cache.answer("k", at("2.0"), make))).toEqual({ n: 3 });
    now += 1; // validUntil (a token's expiry) reached before the age
    expect(await body(cache.answer("k", at("2.0"), make))).toEqual({ n: 4 });
    expect(cache.counts).toEqual({ given: 2, made: 4 });
  });

  it("keeps an answer across writes to tables it did not read, not across one to a table it read", async () => {
    const cache = new AnswerCache();
    const mark = (version: string, studies: number, jobs: number): ChangeMark => ({
      version,
      tables: new Map([
        ["studies", studies],
        ["jobs", jobs],
      ]),
    });
    let n = 0;
    const made = (reads?: string[] | null) => async () => ({ response: json({ n: ++n }), reads });
    const body = async (r: Promise<Response>) => (await r).json();
    expect(await body(cache.answer("k", mark("1", 5, 7), made(["studies"])))).toEqual({ n: 1 });
    expect(await body(cache.answer("k", mark("2", 5, 8), made(["studies"])))).toEqual({ n: 1 }); // jobs written
    expect(await body(cache.answer("k", mark("3", 5, 9), made(["studies"])))).toEqual({ n: 1 });
    expect(await body(cache.answer("k", mark("4", 6, 9), made(["studies"])))).toEqual({ n: 2 }); // studies written
    // Made from a table not counted, or from tables not known: any write ends it.
    expect(await body(cache.answer("u", mark("4", 6, 9), made(["studies", "uncounted"])))).toEqual({ n: 3 });
    expect(await body(cache.answer("u", mark("5", 6, 10), made(["studies", "uncounted"])))).toEqual({ n: 4 });
    expect(await body(cache.answer("v", mark("5", 6, 10), made(null)))).toEqual({ n: 5 });
    expect(await body(cache.answer("v", mark("5", 6, 10), made(null)))).toEqual({ n: 5 });
    expect(await body(cache.answer("v", mark("6", 6, 11), made(null)))).toEqual({ n: 6 });
  });

  it("ends an answer at its age", async () => {
    let now = 0;
    const cache = new AnswerCache({ maxAgeMs: 1000, now: () => now });
    let n = 0;
    const make = async () => ({ response: json({ n: ++n }) });
    await cache.answer("k", at("1.0"), make);
    now = 999;
    expect(await (await cache.answer("k", at("1.0"), make)).json()).toEqual({ n: 1 });
    now = 1000;
    expect(await (await cache.answer("k", at("1.0"), make)).json()).toEqual({ n: 2 });
  });

  it("keeps only 200 JSON answers, each with its status and headers", async () => {
    const cache = new AnswerCache();
    let n = 0;
    const notFound = async () => ({ response: json({ error: { code: "not_found", n: ++n } }, 404) });
    expect((await cache.answer("k", at("1.0"), notFound)).status).toBe(404);
    expect(await (await cache.answer("k", at("1.0"), notFound)).json()).toEqual({ error: { code: "not_found", n: 2 } });
    const csv = async () => ({ response: new Response(`n\n${++n}\n`, { headers: { "content-type": "text/csv" } }) });
    await cache.answer("c", at("1.0"), csv);
    expect(await (await cache.answer("c", at("1.0"), csv)).text()).toBe("n\n4\n");
    const withHeaders = async () => ({
      response: new Response('{"n":1}', {
        headers: { "content-type": "application/json", "cache-control": "no-store" },
      }),
    });
    await cache.answer("h", at("1.0"), withHeaders);
    const again = await cache.answer("h", at("1.0"), async () => {
      throw new Error("should have been given again");
    });
    expect(again.headers.get("cache-control")).toBe("no-store");
    expect(again.headers.get("content-type")).toBe("application/json");
    expect(await again.text()).toBe('{"n":1}');
  });

  it("keeps at most its bytes, the least recently given going first, and no answer above its limit", async () => {
    const cache = new AnswerCache({ maxBytes: 3 * 100, maxAnswerBytes: 150 });
    const of = (bytes: number) => async () => ({ response: json("x".repeat(bytes - 2)) }); // JSON quotes: 2 bytes
    for (const k of ["a", "b", "c"]) await cache.answer(k, at("1"), of(100));
    expect(cache.size).toEqual({ answers: 3, bytes: 300 });
    await cache.answer("a", at("1"), of(100)); // given again: now the most recent
    await cache.answer("d", at("1"), of(100)); // "b" goes
    expect(cache.size).toEqual({ answers: 3, bytes: 300 });
    const made = cache.counts.made;
    await cache.answer("a", at("1"), of(100));
    expect(cache.counts.made).toBe(made);
    await cache.answer("b", at("1"), of(100));
    expect(cache.counts.made).toBe(made + 1);
    await cache.answer("big", at("1"), of(151));
    await cache.answer("big", at("1"), of(151));
    expect(cache.counts.made).toBe(made + 3);
    expect(cache.size.bytes).toBeLessThanOrEqual(300);
  });

  it("makes an answer once for requests that arrive while it is made; a failure leaves each to make its own", async () => {
    const cache = new AnswerCache();
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    let n = 0;
    const slow = async () => {
      n++;
      await gate;
      return { response: json({ n }) };
    };
    const all = Promise.all(Array.from({ length: 5 }, () => cache.answer("k", at("1.0"), slow)));
    release();
    expect(await Promise.all((await all).map((r) => r.json()))).toEqual(Array(5).fill({ n: 1 }));
    expect(n).toBe(1);

    let fails = 0;
    let unblock!: () => void;
    const blocked = new Promise<void>((resolve) => (unblock = resolve));
    const failing = async () => {
      fails++;
      await blocked;
      throw new Error("the database went away");
    };
    const tries = Array.from({ length: 3 }, () =>
      cache.answer("f", at("1.0"), failing).then(
        () => "ok",
        (e: Error) => e.message,
      ),
    );
    unblock();
    expect(await Promise.all(tries)).toEqual(Array(3).fill("the database went away"));
    expect(fails).toBe(3);
  });
});

/** PostgreSQL has no change mark: there every answer is made, and only what it says is checked. */
const keeping = process.env.MORPHOKIN_TEST_DB !== "postgres";

describe("lab lists and details for API scripts", () => {
  const lab = setupLabApi({ setup: async () => void (await stopJobs()) }); // no heartbeat writes between calls
  afterEach(() => vi.useRealTimers());
  const studies = (who: "scientist" | "manager" = "scientist") =>
    lab.api("GET", "/api/v1/labs/[labId]/studies", { who, query: "sort=name&order=asc" });
  const study = (name: string) => ({ name, tissue: "dorsal skin", organism: "invented newt" });
  const names = (body: { items: { name: string }[] }) => body.items.map((s) => s.name);

  it.runIf(keeping)("are given again while nothing changed", async () => {
    await studies(); // the token's lastUsedAt, due once a minute, is written by the first call
    const first = await studies();
    const given = labAnswers().counts.given;
    const second = await studies();
    expect(second.body).toEqual(first.body);
    expect(labAnswers().counts.given).toBe(given + 1);
  });

  it("are made again after any write to what they show, by any connection", async () => {
    const created = await lab.api("POST", "/api/v1/labs/[labId]/studies", { json: study("Kept answers A") });
    expect(created.status).toBe(201);
    expect(names((await studies()).body)).toContain("Kept answers A");
    expect(names((await studies()).body)).toContain("Kept answers A");

    // A write through the API (this process, outside a transaction or in one).
    await lab.api("POST", "/api/v1/labs/[labId]/studies", { json: study("Kept answers B") });
    expect(names((await studies()).body)).toContain("Kept answers B");

    // A write on this process's default connection, outside the API.
    const m = await database();
    await m.Study.update({ name: "Kept answers A, renamed" }, { where: { id: created.body.id } });
    expect(names((await studies()).body)).toContain("Kept answers A, renamed");

    // A write in a transaction (a connection of its own).
    await m.Study.sequelize!.transaction((transaction) =>
      m.Study.update({ name: "Kept answers A, in a transaction" }, { where: { id: created.body.id }, transaction }),
    );
    expect(names((await studies()).body)).toContain("Kept answers A, in a transaction");

    // A write by another process's connection (a second database object on the same file).
    const { databaseUrl, databasePath } = services().config;
    const other = createDatabase(databaseUrl || databasePath, { migrate: false });
    await other.ready;
    await other.sequelize.query(
      `UPDATE studies SET name = 'Kept answers A, elsewhere' WHERE id = '${created.body.id}'`,
    );
    await other.sequelize.close();
    expect(names((await studies()).body)).toContain("Kept answers A, elsewhere");
  });

  it("are kept per token: another member's answer is made for that member", async () => {
    const audit = (who: "manager" | "scientist") => lab.api("GET", "/api/v1/labs/[labId]/audit", { who });
    expect((await audit("manager")).status).toBe(200);
    expect((await audit("manager")).status).toBe(200);
    expect((await audit("scientist")).status).toBe(403);
  });

  it("follow a revoked token, a changed role and a removed membership at once", async () => {
    const m = await database();
    const scientist = lab.w.people.scientist;
    expect((await studies()).status).toBe(200);
    expect((await studies()).status).toBe(200);
    const tokenWhere = { where: { userId: scientist.actor.userId } };
    await m.ApiToken.update({ revokedAt: new Date() }, tokenWhere);
    expect((await studies()).status).toBe(401);
    await m.ApiToken.update({ revokedAt: null }, tokenWhere);
    expect((await studies()).status).toBe(200);

    const audit = () => lab.api("GET", "/api/v1/labs/[labId]/audit", { who: "manager" });
    const memberWhere = { where: { userId: lab.w.people.manager.actor.userId, labId: lab.w.labId } };
    expect((await audit()).status).toBe(200);
    await m.Membership.update({ role: "collaborator" }, memberWhere);
    expect((await audit()).status).toBe(403);
    await m.Membership.update({ role: "manager" }, memberWhere);
    expect((await audit()).status).toBe(200);

    const row = await m.Membership.findOne({ where: { userId: scientist.actor.userId, labId: lab.w.labId } });
    await row!.destroy();
    expect((await studies()).status).toBe(404);
    await m.Membership.create({ ...row!.get({ plain: true }) });
    expect((await studies()).status).toBe(200);
  });

  it.runIf(keeping)("end when their token expires, though nothing was written", async () => {
    const m = await database();
    const person = lab.w.people.collaborator;
    const t0 = new Date();
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(t0);
    await m.ApiToken.update({ expiresAt: new Date(t0.getTime() + 500) }, { where: { userId: person.actor.userId } });
    const get = () => lab.api("GET", "/api/v1/labs/[labId]/studies", { who: person });
    expect((await get()).status).toBe(200);
    expect((await get()).status).toBe(200); // kept (the first wrote the token's lastUsedAt)
    const made = labAnswers().counts.made;
    vi.setSystemTime(t0.getTime() + 600); // younger than the age limit, but the token expired
    const after = await get();
    expect(after.status).toBe(401);
    expect(after.body.error.message).toMatch(/expired/);
    expect(labAnswers().counts.made).toBe(made + 1);
    vi.useRealTimers();
    await m.ApiToken.update({ expiresAt: null, expiryRecordedAt: null }, { where: { userId: person.actor.userId } });
  });

  it.runIf(keeping)("are made once for many scripts asking at the same moment", async () => {
    await studies(); // the token's lastUsedAt, due once a minute, is written by this one
    await lab.api("POST", "/api/v1/labs/[labId]/studies", { json: study("Kept answers C") });
    const made = labAnswers().counts.made;
    const answers = await Promise.all(Array.from({ length: 10 }, () => studies()));
    expect(new Set(answers.map((a) => JSON.stringify(a.body))).size).toBe(1);
    expect(names(answers[0].body)).toContain("Kept answers C");
    expect(labAnswers().counts.made).toBe(made + 1);
  });
});
