/**
 * Sequelize opens one sqlite3 connection per transaction. Every connection must wait for another
 * connection's write lock (lib/server/db.ts, BUSY_TIMEOUT_MS) rather than sqlite3's own 1 s: a job
 * writing its progress while a request saves in a transaction on a loaded machine is the everyday
 * case, and 1 s (even with Sequelize's retries) was seen to end in SQLITE_BUSY.
 *
 * The writes of one process take turns in a JS write queue (lib/server/db.ts): many at once all
 * commit, none parks a libuv thread in the busy handler, a write that would wait too long is a
 * 503 with Retry-After, and reads never wait for the turn.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Transaction } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { BUSY_TIMEOUT_MS, createDatabase } from "@/lib/server/db";
import { ServerBusyError } from "@/lib/server/errors";

const dir = mkdtempSync(path.join(tmpdir(), "morphokin-db-"));
const db = createDatabase(path.join(dir, "t.sqlite"), { migrate: false });
afterAll(async () => {
  await db.sequelize.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("SQLite connections", () => {
  it("the default connection and each transaction's own connection wait BUSY_TIMEOUT_MS for a lock", async () => {
    await db.ready;
    const timeout = async (transaction?: Transaction) => {
      const [rows] = await db.sequelize.query("PRAGMA busy_timeout", { transaction });
      return Object.values((rows as Record<string, number>[])[0])[0];
    };
    expect(BUSY_TIMEOUT_MS).toBe(5000);
    expect(await timeout()).toBe(BUSY_TIMEOUT_MS);
    const [a, b] = await Promise.all([
      db.sequelize.transaction((t) => timeout(t)),
      db.sequelize.transaction((t) => timeout(t)),
    ]);
    expect([a, b]).toEqual([BUSY_TIMEOUT_MS, BUSY_TIMEOUT_MS]);
  });

  it("a transaction that reads, then writes after another connection wrote, still commits", async () => {
    await db.sequelize.query("CREATE TABLE IF NOT EXISTS t (n INTEGER)");
    let outside: Promise<unknown> | null = null;
    await db.sequelize.transaction(async (transaction) => {
      await db.sequelize.query("SELECT COUNT(*) FROM t", { transaction }); // a read snapshot
      outside = db.sequelize.query("INSERT INTO t VALUES (1)"); // another connection writes meanwhile
      await new Promise((r) => setTimeout(r, 200));
      await db.sequelize.query("INSERT INTO t VALUES (2)", { transaction });
    });
    await outside;
    const [rows] = await db.sequelize.query("SELECT n FROM t ORDER BY n");
    expect(rows).toEqual([{ n: 1 }, { n: 2 }]);
  }, 30_000);
});

describe("the write queue", () => {
  const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

  it("40 read-then-write transactions at once all commit, within seconds", async () => {
    await db.sequelize.query("CREATE TABLE IF NOT EXISTS q (n INTEGER)");
    const t0 = Date.now();
    await Promise.all(
      Array.from({ length: 40 }, (_, i) =>
        db.sequelize.transaction(async (transaction) => {
          await db.sequelize.query("SELECT COUNT(*) FROM q", { transaction });
          await sleep(5);
          await db.sequelize.query(`INSERT INTO q VALUES (${i})`, { transaction });
        }),
      ),
    );
    // Before the queue, 40 connections waiting in the busy handler held all four libuv threads and
    // ended in SQLITE_BUSY after BUSY_TIMEOUT_MS; the bound is common practice, no source.
    expect(Date.now() - t0).toBeLessThan(BUSY_TIMEOUT_MS);
    const [rows] = await db.sequelize.query("SELECT COUNT(*) AS n FROM q");
    expect(rows).toEqual([{ n: 40 }]);
  }, 30_000);

  it("a write that would wait longer than its bound is a 503 saying when to retry; reads do not wait", async () => {
    const dir2 = mkdtempSync(path.join(tmpdir(), "morphokin-db-"));
    const short = createDatabase(path.join(dir2, "t.sqlite"), { migrate: false, writeWaitMs: 200 });
    try {
      await short.ready;
      await short.sequelize.query("CREATE TABLE w (n INTEGER)");
      let readMs = -1;
      let refused: unknown = null;
      await short.sequelize.transaction(async (transaction) => {
        await short.sequelize.query("INSERT INTO w VALUES (1)", { transaction });
        const t0 = Date.now();
        await short.sequelize.query("SELECT COUNT(*) FROM w"); // another connection, no turn needed
        readMs = Date.now() - t0;
        refused = await short.sequelize.query("INSERT INTO w VALUES (2)").then(
          () => null,
          (err: unknown) => err,
        );
      });
      expect(readMs).toBeGreaterThanOrEqual(0);
      expect(readMs).toBeLessThan(200);
      expect(refused).toBeInstanceOf(ServerBusyError);
      const busy = refused as ServerBusyError;
      expect(busy.status).toBe(503);
      expect(busy.retryAfterS).toBeGreaterThanOrEqual(1);
      expect(busy.message).toMatch(/^the server is busy \(too many writes at once\); try again in \d+ s$/);
      const [rows] = await short.sequelize.query("SELECT n FROM w");
      expect(rows).toEqual([{ n: 1 }]);
    } finally {
      await short.sequelize.close();
      rmSync(dir2, { recursive: true, force: true });
    }
  });

  it("an unmanaged transaction (findOrCreate makes one) holds the turn until it commits", async () => {
    await db.sequelize.query("CREATE TABLE IF NOT EXISTS u (n INTEGER)");
    const t = await db.sequelize.transaction();
    await db.sequelize.query("INSERT INTO u VALUES (1)", { transaction: t });
    const order: string[] = [];
    const outside = db.sequelize.query("INSERT INTO u VALUES (2)").then(() => order.push("outside"));
    await sleep(50);
    expect(db.writeQueue!.waiting).toBe(1); // waiting in JS, not in SQLite's busy handler
    order.push("commit");
    await t.commit();
    await outside;
    expect(order).toEqual(["commit", "outside"]);
  });
});
