/**
 * Per-table change counts (lib/server/change-counts.ts) and the kept answers that use them: a
 * write ends the kept answers that read its table, and only those. SQLite only (PostgreSQL keeps
 * no answers; vitest.config.mts leaves this file out of the postgres project). Every expected value is a count of rows the test wrote or the API's own fresh
 * answer (common practice, no source).
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { countChangesOfEveryTable, tableNamer } from "@/lib/server/change-counts";
import { createDatabase, type Database } from "@/lib/server/db";
import { stopJobs } from "@/lib/server/jobs/worker";
import { createMigrator } from "@/lib/server/migrate";
import { database, services } from "@/lib/server/services";
import { labAnswers } from "@/lib/server/web/lab-route";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { setupReadoutLab } from "../support/readouts";

const one = async (db: Database, sql: string) => (await db.select(sql, []))[0];
const countOf = async (db: Database, table: string) => (await db.changeMark())!.tables.get(table);

describe("tableNamer", () => {
  it("names the tables a statement names as whole words, in any case, and nothing else", () => {
    const name = tableNamer(["studies", "jobs", "SequelizeMeta", "labs"]);
    expect(
      name([
        "SELECT `studies`.`id`, `studies`.`job_id` FROM `studies` LEFT JOIN Jobs ON Jobs.id = studies.job_id",
        'SELECT name FROM "SequelizeMeta"',
      ]).sort(),
    ).toEqual(["SequelizeMeta", "jobs", "studies"]);
    expect(name(["SELECT lab_id, labsx, xlabs FROM memberships"])).toEqual([]);
  });
});

describe("change counts", () => {
  let dir = "";
  let db: Database;
  beforeAll(async () => {
    dir = mkdtempSync(path.join(tmpdir(), "morphokin-counts-"));
    db = createDatabase(path.join(dir, "c.sqlite"));
    await db.ready;
  });
  afterAll(async () => {
    await db.sequelize.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it("count the rows written to each table, by any connection, and only that table's", async () => {
    const tables = (await db.select("SELECT name FROM sqlite_master WHERE type = 'table'", [])).map((r) => r.name);
    const mark = (await db.changeMark())!;
    // Every table but SQLite's own and the counts themselves is counted from the first start.
    expect([...mark.tables.keys()].sort()).toEqual(
      tables.filter((t) => t !== "change_counts" && !String(t).startsWith("sqlite_")).sort(),
    );
    const labs = mark.tables.get("labs")!;
    const studies = mark.tables.get("studies")!;
    await db.sequelize.query("INSERT INTO labs (id, name, created_at, updated_at) VALUES ('l1', 'A', 0, 0)");
    await db.sequelize.query("INSERT INTO labs (id, name, created_at, updated_at) VALUES ('l2', 'B', 0, 0)");
    expect(await countOf(db, "labs")).toBe(labs + 2);

    const other = createDatabase(path.join(dir, "c.sqlite"), { migrate: false });
    await other.ready;
    await other.sequelize.query("UPDATE labs SET name = 'C'"); // two rows
    await other.sequelize.query("DELETE FROM labs WHERE id = 'l2'");
    await other.sequelize.close();
    const after = (await db.changeMark())!;
    expect(after.version).not.toBe(mark.version);
    expect(after.tables.get("labs")).toBe(labs + 5);
    expect(after.tables.get("studies")).toBe(studies);
  });

  it("count a table a later migration adds, rebuilds or renames from the next start; not before", async () => {
    await db.sequelize.query("CREATE TABLE later_things (id TEXT PRIMARY KEY)");
    // Made after the start's migrations: not counted, so nothing read from it is kept.
    expect((await db.changeMark())!.tables.has("later_things")).toBe(false);
    await countChangesOfEveryTable(db.sequelize); // what the next start does
    expect(await countOf(db, "later_things")).toBe(0);
    await db.sequelize.query("INSERT INTO later_things VALUES ('a')");
    expect(await countOf(db, "later_things")).toBe(1);

    await db.sequelize.query("ALTER TABLE later_things RENAME TO renamed_things");
    // Its triggers moved with it but still count under the old name: not counted until the next start.
    expect((await db.changeMark())!.tables.has("renamed_things")).toBe(false);
    await countChangesOfEveryTable(db.sequelize);
    await db.sequelize.query("INSERT INTO renamed_things VALUES ('b')");
    const mark = (await db.changeMark())!;
    expect(mark.tables.get("renamed_things")).toBe(1);
    expect(mark.tables.has("later_things")).toBe(false);

    // A table dropped and made again (SQLite's way of changing a column) loses its triggers with it.
    await db.sequelize.query("DROP TABLE renamed_things");
    await db.sequelize.query("CREATE TABLE renamed_things (id TEXT PRIMARY KEY, note TEXT)");
    expect((await db.changeMark())!.tables.has("renamed_things")).toBe(false);
    await countChangesOfEveryTable(db.sequelize);
    await db.sequelize.query("INSERT INTO renamed_things VALUES ('c', 'x')");
    expect(await countOf(db, "renamed_things")).toBe(2);
  });

  it("go with their migration's down, and writes go on without them", async () => {
    const migrator = createMigrator(db.sequelize);
    await migrator.down({ to: "20261205-2130-change-counts" });
    expect(await one(db, "SELECT count(*) AS n FROM sqlite_master WHERE name LIKE 'change_count%'")).toEqual({ n: 0 });
    await db.sequelize.query("INSERT INTO labs (id, name, created_at, updated_at) VALUES ('l3', 'D', 0, 0)");
    expect((await db.changeMark())!.tables.size).toBe(0); // nothing counted: every write ends every answer
    await migrator.up();
    await countChangesOfEveryTable(db.sequelize);
    await db.sequelize.query("INSERT INTO labs (id, name, created_at, updated_at) VALUES ('l4', 'E', 0, 0)");
    expect(await countOf(db, "labs")).toBe(1);
  });
});

describe("kept answers and the tables they read", () => {
  const r = setupReadoutLab();
  const lab = r.lab;
  beforeAll(async () => void (await stopJobs())); // readouts stay queued; no heartbeats between calls
  const get = (p: string, query?: string) => lab.api("GET", p, { query });

  it("name what the answer was made from", async () => {
    const { tables } = await services().db.tablesReadBy(() => get("/api/v1/labs/[labId]/studies"));
    expect(tables).toEqual(expect.arrayContaining(["studies", "api_tokens", "users", "memberships"]));
    expect(tables).not.toContain("jobs");
  });

  it("are kept across writes to tables they did not read, and made again after one they read", async () => {
    const studies = () => get("/api/v1/labs/[labId]/studies");
    await studies(); // the token's lastUsedAt, due once a minute
    const first = await studies();
    const { given, made } = labAnswers().counts;
    // A job's progress and a worker's heartbeat, written by another process.
    const other = createDatabase(services().config.databasePath, { migrate: false });
    await other.ready;
    await other.sequelize.query("UPDATE jobs SET progress = progress");
    await other.sequelize.query("UPDATE workers SET seen_at = seen_at");
    await other.sequelize.query(
      "INSERT INTO workers (id, role, host, pid, concurrency, started_at, seen_at) " +
        "VALUES ('w-test', 'worker', 'h', 1, 1, 0, 0)",
    );
    const again = await studies();
    expect(again.body).toEqual(first.body);
    expect(labAnswers().counts).toEqual({ given: given + 1, made });
    await other.sequelize.query(`UPDATE studies SET name = 'Renamed elsewhere' WHERE lab_id = '${lab.w.labId}'`);
    await other.sequelize.close();
    const renamed = await studies();
    expect(renamed.body.items.map((s: { name: string }) => s.name)).toContain("Renamed elsewhere");
    expect(labAnswers().counts.made).toBe(made + 1);
  });

  it("show a queued readout's new progress: its list read the jobs", async () => {
    const specimen = await r.newSpecimen();
    const bytes = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0, seed: 1 }));
    const up = await r.uploadFile(specimen.id, "stripes.png", bytes, { pixelSizeUm: "1" });
    expect(up.status).toBe(201);
    const jobId = up.body.readout!.jobId!;
    const readouts = async () =>
      (await get("/api/v1/labs/[labId]/readouts")).body.items.find((x: { id: string }) => x.id === up.body.readout!.id);
    expect((await readouts()).progress).toBe(0);
    expect((await readouts()).progress).toBe(0);
    const m = await database();
    await m.Job.update({ progress: 0.5, progressNote: "FFT" }, { where: { id: jobId } });
    expect(await readouts()).toMatchObject({ progress: 0.5, progressNote: "FFT" });
  });
});
