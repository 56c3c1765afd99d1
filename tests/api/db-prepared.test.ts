/**
 * Database.select on SQLite keeps each SELECT prepared on its connection (lib/server/db.ts). A kept
 * statement must answer like a fresh one: rows written since its last run, its own parameters
 * each time, SQLite's error for bad SQL (and not be kept then), at most PREPARED_PER_CONNECTION
 * kept, and the connection must still close (SQLite refuses to close one with unfinalized
 * statements: sqlite3_close, "SQLITE_BUSY", from memory). Expected rows: arithmetic on the rows
 * written here.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { createDatabase, PREPARED_PER_CONNECTION } from "@/lib/server/db";

const dir = mkdtempSync(path.join(tmpdir(), "morphokin-prepared-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function openWithTable(name: string) {
  const db = createDatabase(path.join(dir, name), { migrate: false });
  await db.ready;
  await db.sequelize.query("CREATE TABLE spots (id INTEGER PRIMARY KEY, label TEXT, spacing REAL)");
  return { db, kept: () => db.preparedCount!() };
}

describe("prepared SELECTs on SQLite", () => {
  it("see rows written since their last run, with each call's own parameters", async () => {
    const { db, kept } = await openWithTable("a.sqlite");
    const sql = 'SELECT "label", "spacing" FROM spots WHERE "spacing" > $1 ORDER BY "id"';
    expect(await db.select(sql, [10])).toEqual([]);
    await db.sequelize.query("INSERT INTO spots (label, spacing) VALUES ('row 1', 12.5), ('row 2', 8), ('row 3', 20)");
    expect(await db.select(sql, [10])).toEqual([
      { label: "row 1", spacing: 12.5 },
      { label: "row 3", spacing: 20 },
    ]);
    expect(await db.select(sql, [15])).toEqual([{ label: "row 3", spacing: 20 }]);
    // The same statement from many requests at once: each gets its own answer.
    const answers = await Promise.all([5, 10, 15, 25].map((min) => db.select(sql, [min])));
    expect(answers.map((rows) => rows.length)).toEqual([3, 2, 1, 0]);
    expect(await kept()).toBe(1);
    await db.sequelize.close();
  });

  it("reject bad SQL with SQLite's message and do not keep it; the connection goes on answering", async () => {
    const { db, kept } = await openWithTable("b.sqlite");
    await expect(db.select("SELECT nope FROM spots", [])).rejects.toThrow(/no such column: nope.*\(in SELECT/);
    await expect(db.select("SELECT nope FROM spots", [])).rejects.toThrow(/no such column: nope/);
    expect(await db.select("SELECT COUNT(*) AS n FROM spots", [])).toEqual([{ n: 0 }]);
    expect(await kept()).toBe(1);
    await db.sequelize.close();
  });

  it(`keep at most ${PREPARED_PER_CONNECTION} per connection, and close with all of them kept`, async () => {
    const { db, kept } = await openWithTable("c.sqlite");
    await db.sequelize.query("INSERT INTO spots (label, spacing) VALUES ('row 1', 12.5)");
    for (let i = 0; i < PREPARED_PER_CONNECTION + 20; i++) {
      expect(await db.select(`SELECT ${i} AS k, "label" FROM spots`, [])).toEqual([{ k: i, label: "row 1" }]);
    }
    expect(await kept()).toBe(PREPARED_PER_CONNECTION);
    // The least recently used went first: the newest still answers.
    expect(await db.select(`SELECT ${PREPARED_PER_CONNECTION + 19} AS k, "label" FROM spots`, [])).toHaveLength(1);
    await expect(db.sequelize.close()).resolves.toBeUndefined();
  });

  it("never hold up the models' own queries, however many run at once", async () => {
    // Sequelize runs each statement in sqlite3's serialized mode, where it waits until no other
    // statement of its connection runs; on a shared connection 25 readers in a loop held a model's
    // query until they stopped. Bound: 10 s, far above the few ms it takes alone.
    const { db } = await openWithTable("d.sqlite");
    await db.sequelize.query("INSERT INTO spots (label, spacing) VALUES ('row 1', 12.5), ('row 2', 8)");
    let reading = true;
    let reads = 0;
    const readers = Array.from({ length: 25 }, async (_, i) => {
      while (reading) {
        await db.select(`SELECT "label" FROM spots WHERE "spacing" > $1 LIMIT ${(i % 5) + 1}`, [0]);
        reads++;
      }
    });
    // The readers are running: wait for their first answers.
    while (reads < 100) await new Promise((resolve) => setImmediate(resolve));
    const bounded = <T>(p: Promise<T>, what: string) =>
      Promise.race([
        p,
        new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`${what}: no answer in 10 s`)), 10_000)),
      ]);
    try {
      const before = reads;
      await bounded(db.sequelize.query("UPDATE spots SET spacing = 9 WHERE label = 'row 2'"), "a model's write");
      const [rows] = await bounded(db.sequelize.query("SELECT COUNT(*) AS n FROM spots"), "a model's read");
      expect(rows).toEqual([{ n: 2 }]);
      expect(reads).toBeGreaterThan(before); // the readers went on meanwhile
      expect(await db.select('SELECT "spacing" FROM spots WHERE "label" = $1', ["row 2"])).toEqual([{ spacing: 9 }]);
    } finally {
      reading = false;
      await Promise.all(readers);
      await db.sequelize.close();
    }
  }, 30_000);
});
