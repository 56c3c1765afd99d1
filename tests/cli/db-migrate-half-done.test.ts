/**
 * Migrating a SQLite file that a stopped or failed migration left half-done: a migration applies
 * whole or not at all (one transaction with its SequelizeMeta row), and a file an older version
 * left half-migrated stops start-up with a message naming the file, the migration and what to do.
 * Expected values are the product's own rule (common practice, no source); the failing step is
 * the one seen after an interrupted test run ("index lab_kinetics_lab_id already exists").
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { DataTypes, QueryTypes, type QueryInterface } from "sequelize";
import { createDatabase, type Database } from "@/lib/server/db";
import { MigrationFailedError, migrateUp, type MigrationModule } from "@/lib/server/migrate";
import { migrationModules } from "@/migrations";

const dir = mkdtempSync(path.join(tmpdir(), "morphokin-migrate-"));
const opened: Database[] = [];
afterAll(async () => {
  await Promise.allSettled(opened.map((d) => d.sequelize.close()));
  rmSync(dir, { recursive: true, force: true });
});

function openEmpty(name: string): Database {
  const db = createDatabase(path.join(dir, name), { migrate: false });
  opened.push(db);
  return db;
}

async function names(db: Database, sql: string): Promise<string[]> {
  const rows = await db.sequelize.query<{ name: string }>(sql, { type: QueryTypes.SELECT });
  return rows.map((r) => r.name);
}
const tables = (db: Database) => names(db, "SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name");
const applied = (db: Database) => names(db, 'SELECT name FROM "SequelizeMeta" ORDER BY name');

/** A migration that creates a table and an index, then fails (or, with `fail` false, completes). */
function halfway(fail: boolean): MigrationModule {
  return {
    name: "20990101-0001-halfway",
    module: {
      up: async ({ context: qi }: { context: QueryInterface }) => {
        await qi.createTable("halfway_things", { id: { type: DataTypes.UUID, primaryKey: true } });
        await qi.addIndex("halfway_things", ["id"], { name: "halfway_things_id" });
        if (fail) throw new Error("stopped halfway");
      },
      down: async () => undefined,
    },
  };
}

describe("migrations left half-done", () => {
  it("a migration that fails halfway keeps nothing, and the next start applies it whole", async () => {
    const db = openEmpty("failed.sqlite");
    await db.ready;
    const first = migrationModules.slice(0, 1);
    await expect(migrateUp(db.sequelize, [...first, halfway(true)])).rejects.toThrow(MigrationFailedError);
    // The first migration completed and stays; nothing of the failed one is left.
    expect(await applied(db)).toEqual([first[0].name]);
    expect(await tables(db)).not.toContain("halfway_things");
    expect(await migrateUp(db.sequelize, [...first, halfway(false)])).toEqual(["20990101-0001-halfway"]);
    expect(await tables(db)).toContain("halfway_things");
    // Foreign keys are back on for the connection the app goes on using.
    expect(await db.sequelize.query("PRAGMA foreign_keys", { type: QueryTypes.SELECT })).toEqual([{ foreign_keys: 1 }]);
  });

  it("a file an older version left half-migrated stops with the file, the migration and what to do", async () => {
    const file = path.join(dir, "older.sqlite");
    const db = openEmpty("older.sqlite");
    await db.ready;
    await migrateUp(db.sequelize, migrationModules.slice(0, 1));
    // What an interrupted older start left: the second migration's tables and indexes, unrecorded.
    const second = migrationModules[1];
    await second.module.up({ context: db.sequelize.getQueryInterface(), name: second.name, path: undefined });
    const err = await migrateUp(db.sequelize).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(MigrationFailedError);
    const message = (err as Error).message;
    expect(message).toContain(`the SQLite file ${file}`);
    expect(message).toContain(`migration ${second.name} failed`);
    expect(message).toContain("already exists");
    expect(message).toContain("delete it and start again");
    expect(message).toContain("restore it from a backup");
    expect(await applied(db)).toEqual([migrationModules[0].name]);
  });

  it("every shipped migration applies on a new file, each recorded once", async () => {
    const db = openEmpty("new.sqlite");
    await db.ready;
    expect(await migrateUp(db.sequelize)).toEqual(migrationModules.map((m) => m.name));
    expect(await applied(db)).toEqual(migrationModules.map((m) => m.name).sort());
    expect(await db.sequelize.query("PRAGMA foreign_key_check", { type: QueryTypes.SELECT })).toEqual([]);
  });
});
