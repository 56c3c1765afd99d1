/**
 * SQLite only: how many rows have been written to each table, one row per table, kept by triggers
 * (lib/server/change-counts.ts makes them after every start's migrations). A lab's kept answers
 * then end when a table they read was written, not at every write anywhere. PostgreSQL keeps no
 * answers (no change mark), so it gets nothing here.
 */
import { QueryTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  if (qi.sequelize.getDialect() !== "sqlite") return;
  await qi.sequelize.query(
    "CREATE TABLE change_counts (table_name TEXT PRIMARY KEY NOT NULL, changes INTEGER NOT NULL DEFAULT 0)",
  );
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  if (qi.sequelize.getDialect() !== "sqlite") return;
  // The triggers write to the table: they go first, or every later write would fail.
  const triggers = await qi.sequelize.query<{ name: string }>(
    "SELECT name FROM sqlite_master WHERE type = 'trigger' AND name LIKE 'change\\_count\\_%' ESCAPE '\\'",
    { type: QueryTypes.SELECT },
  );
  for (const { name } of triggers) await qi.sequelize.query(`DROP TRIGGER IF EXISTS "${name.replace(/"/g, '""')}"`);
  await qi.sequelize.query("DROP TABLE change_counts");
};
