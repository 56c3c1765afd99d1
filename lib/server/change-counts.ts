/**
 * SQLite: each table's count of written rows, in `change_counts` (migration
 * 20261205-2130-change-counts), kept by three triggers per table that add one for every row
 * inserted, updated or deleted, whichever connection or process wrote it (SQLite docs,
 * lang_createtrigger.html; rows deleted by a foreign key's ON DELETE fire their table's triggers,
 * foreignkeys.html §4). A lab's kept answers (web/answer-cache.ts) end when a table they read was
 * written: a readout's progress (jobs) or a worker's heartbeat (workers) no longer ends the lab's
 * studies list.
 *
 * The triggers are made after every start's migrations (migrate.ts) for every table that lacks
 * them, so a table added or rebuilt by a later migration (SQLite drops a table's triggers with it)
 * is counted without that migration saying so, and a renamed table's are made again under its new
 * name. A table without its three triggers is not counted (countedTables): what reads it is never kept.
 */
import "server-only";
import { QueryTypes, type Sequelize } from "sequelize";

export const CHANGE_COUNTS = "change_counts";
const OPERATIONS = ["insert", "update", "delete"] as const;
const triggerName = (table: string, op: string) => `change_count_${table}_${op}`;
const ident = (name: string) => `"${name.replace(/"/g, '""')}"`;
const literal = (text: string) => `'${text.replace(/'/g, "''")}'`;

export interface SchemaObject {
  type: string;
  name: string;
  tbl_name: string;
}

/** The query for countedTables' input: every table and trigger of the schema. */
export const SCHEMA_OBJECTS_SQL = "SELECT type, name, tbl_name FROM sqlite_master WHERE type IN ('table', 'trigger')";

/** The tables whose writes SQL can name: every table but SQLite's own and the counts themselves. */
export function tablesOf(objects: SchemaObject[]): string[] {
  return objects
    .filter((o) => o.type === "table" && !o.name.startsWith("sqlite_") && o.name !== CHANGE_COUNTS)
    .map((o) => o.name);
}

/** The tables that have all three triggers, each on that table. */
export function countedTables(objects: SchemaObject[]): Set<string> {
  const triggers = new Set(objects.filter((o) => o.type === "trigger").map((o) => `${o.name} ${o.tbl_name}`));
  return new Set(tablesOf(objects).filter((t) => OPERATIONS.every((op) => triggers.has(`${triggerName(t, op)} ${t}`))));
}

/**
 * Makes the missing triggers and count rows, and drops triggers left on a renamed table; nothing
 * when the database has no `change_counts` yet (not migrated that far). One transaction, and none
 * when nothing is missing (every start after the first).
 */
export async function countChangesOfEveryTable(sequelize: Sequelize): Promise<void> {
  const objects = await sequelize.query<SchemaObject>(SCHEMA_OBJECTS_SQL, { type: QueryTypes.SELECT });
  if (!objects.some((o) => o.type === "table" && o.name === CHANGE_COUNTS)) return;
  const tables = tablesOf(objects);
  const rows = new Set(
    (
      await sequelize.query<{ table_name: string }>(`SELECT table_name FROM ${CHANGE_COUNTS}`, {
        type: QueryTypes.SELECT,
      })
    ).map((r) => r.table_name),
  );
  const wanted = new Map(tables.flatMap((t) => OPERATIONS.map((op) => [triggerName(t, op), { t, op }] as const)));
  const present = objects.filter((o) => o.type === "trigger" && o.name.startsWith("change_count_"));
  // A trigger whose name is not its table's (the table was renamed) counts under the old name.
  const stale = present.filter((o) => wanted.get(o.name)?.t !== o.tbl_name);
  const presentNames = new Set(present.filter((o) => !stale.includes(o)).map((o) => o.name));
  const missing = [...wanted].filter(([name]) => !presentNames.has(name));
  const missingRows = tables.filter((t) => !rows.has(t));
  if (!stale.length && !missing.length && !missingRows.length) return;
  await sequelize.transaction(async (transaction) => {
    for (const o of stale) await sequelize.query(`DROP TRIGGER IF EXISTS ${ident(o.name)}`, { transaction });
    for (const t of missingRows)
      await sequelize.query(`INSERT OR IGNORE INTO ${CHANGE_COUNTS} (table_name, changes) VALUES (${literal(t)}, 0)`, {
        transaction,
      });
    for (const [name, { t, op }] of missing)
      await sequelize.query(
        `CREATE TRIGGER IF NOT EXISTS ${ident(name)} AFTER ${op.toUpperCase()} ON ${ident(t)} FOR EACH ROW BEGIN ` +
          `UPDATE ${CHANGE_COUNTS} SET changes = changes + 1 WHERE table_name = ${literal(t)}; END`,
        { transaction },
      );
  });
}

/**
 * A function giving the tables of `tables` that SQL texts name as a whole word, in any case
 * (SQLite's names are case-insensitive): a superset of the tables they read, since a column or an
 * alias spelled like a table only ends an answer sooner than needed.
 */
export function tableNamer(tables: readonly string[]): (sqlTexts: readonly string[]) => string[] {
  const byLower = new Map(tables.map((t) => [t.toLowerCase(), t]));
  if (!byLower.size) return () => [];
  const words = new RegExp(
    `(?<![\\w$])(${[...byLower.keys()].map((t) => t.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")).join("|")})(?![\\w$])`,
    "gi",
  );
  return (sqlTexts) => {
    const found = new Set<string>();
    for (const text of sqlTexts) for (const m of text.matchAll(words)) found.add(byLower.get(m[1].toLowerCase())!);
    return [...found];
  };
}
