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
import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { createDatabase, PREPARED_PER_CONNECTION } from "@/lib/server/db";

const dir = mkdtempSync(path.join(tmpdir(), "morphokin-prepared-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function openWithTable(name: string) {
  const db = createDatabase(path.join(dir, name), { migrate: false });
  await db.ready;
  await db.sequelize.query("CREATE TABLE spots (id INTEGER PRIMARY KEY, label TEXT, spacing REAL)");
  const connection = (await (
    db.sequelize.connectionManager as unknown as { getConnection(o: { type: string }): Promise<unknown> }
  ).getConnection({ type: QueryTypes.SELECT })) as { preparedCount: number };
  return { db, kept: () => connection.preparedCount };
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
    expect(kept()).toBe(1);
    await db.sequelize.close();
  });

  it("reject bad SQL with SQLite's message and do not keep it; the connection goes on answering", async () => {
    const { db, kept } = await openWithTable("b.sqlite");
    await expect(db.select("SELECT nope FROM spots", [])).rejects.toThrow(/no such column: nope.*\(in SELECT/);
    await expect(db.select("SELECT nope FROM spots", [])).rejects.toThrow(/no such column: nope/);
    expect(await db.select("SELECT COUNT(*) AS n FROM spots", [])).toEqual([{ n: 0 }]);
    expect(kept()).toBe(1);
    await db.sequelize.close();
  });

  it(`keep at most ${PREPARED_PER_CONNECTION} per connection, and close with all of them kept`, async () => {
    const { db, kept } = await openWithTable("c.sqlite");
    await db.sequelize.query("INSERT INTO spots (label, spacing) VALUES ('row 1', 12.5)");
    for (let i = 0; i < PREPARED_PER_CONNECTION + 20; i++) {
      expect(await db.select(`SELECT ${i} AS k, "label" FROM spots`, [])).toEqual([{ k: i, label: "row 1" }]);
    }
    expect(kept()).toBe(PREPARED_PER_CONNECTION);
    // The least recently used went first: the newest still answers.
    expect(await db.select(`SELECT ${PREPARED_PER_CONNECTION + 19} AS k, "label" FROM spots`, [])).toHaveLength(1);
    await expect(db.sequelize.close()).resolves.toBeUndefined();
  });
});
