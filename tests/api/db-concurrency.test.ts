/**
 * Sequelize opens one sqlite3 connection per transaction. Every connection must wait for another
 * connection's write lock (lib/server/db.ts, BUSY_TIMEOUT_MS) rather than sqlite3's own 1 s: a job
 * writing its progress while a request saves in a transaction on a loaded machine is the everyday
 * case, and 1 s (even with Sequelize's retries) was seen to end in SQLITE_BUSY.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Transaction } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { BUSY_TIMEOUT_MS, createDatabase } from "@/lib/server/db";

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
