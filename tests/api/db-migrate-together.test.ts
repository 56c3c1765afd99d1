/**
 * Several processes starting at once against one new PostgreSQL database (web servers and
 * workers on other machines) all end up on the migrated schema, none failing on a table another
 * one created. PostgreSQL only: SQLite serves one machine. Expected: every process ready, each
 * migration recorded once (product rule, no source).
 */
import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { createDatabase, type Database } from "@/lib/server/db";
import { migrationModules } from "@/migrations";
import { createTestDatabase } from "../support/postgres";
import { describeTestDialect } from "../support/test-db";

const opened: Database[] = [];
let drop: (() => Promise<void>) | undefined;
afterAll(async () => {
  await Promise.allSettled(opened.map((d) => d.sequelize.close()));
  await drop?.();
});

describe.skipIf(describeTestDialect() !== "postgres")("migrations started together", () => {
  it("four processes migrating one new database at once all get ready, each migration applied once", async () => {
    const target = await createTestDatabase(undefined, { empty: true });
    drop = target.drop;
    for (let i = 0; i < 4; i++) opened.push(createDatabase(target.url));
    const results = await Promise.allSettled(opened.map((d) => d.ready));
    expect(results.map((r) => (r.status === "rejected" ? String(r.reason) : "ready"))).toEqual(Array(4).fill("ready"));
    const rows = await opened[0].sequelize.query<{ name: string }>('SELECT name FROM "SequelizeMeta" ORDER BY name', {
      type: QueryTypes.SELECT,
    });
    expect(rows.map((r) => r.name)).toEqual(migrationModules.map((m) => m.name).sort());
  });
});
