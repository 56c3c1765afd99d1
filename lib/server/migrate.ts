import "server-only";
import { QueryTypes, type QueryInterface, type Sequelize } from "sequelize";
import { MigrationError, SequelizeStorage, Umzug, type MigrationFn } from "umzug";
import { migrationModules } from "@/migrations";
import { countChangesOfEveryTable } from "./change-counts";

/** Any fixed number: the PostgreSQL advisory lock that lets one process migrate at a time. */
const MIGRATION_LOCK_KEY = 7_240_331;

export interface MigrationModule {
  name: string;
  module: { up: MigrationFn<QueryInterface>; down: MigrationFn<QueryInterface> };
}

/** `modules`: the ordered migrations (tests pass their own; the app always the list of migrations/index.ts). */
export function createMigrator(sequelize: Sequelize, modules: MigrationModule[] = migrationModules) {
  return new Umzug<QueryInterface>({
    migrations: modules.map(({ name, module }) => ({
      name,
      up: (p) => module.up(p),
      down: (p) => module.down(p),
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

/** A migration that could not be applied, with the database, the migration and what to do. */
export class MigrationFailedError extends Error {
  constructor(
    message: string,
    readonly migration: string | null,
  ) {
    super(message);
    this.name = "MigrationFailedError";
  }
}

/** Where the database is, for messages: the SQLite file, or the PostgreSQL database without its password. */
function describeDatabase(sequelize: Sequelize): string {
  if (sequelize.getDialect() === "sqlite")
    return `the SQLite file ${String((sequelize as unknown as { options: { storage?: string } }).options.storage)}`;
  const c = sequelize.config;
  return `the PostgreSQL database "${c.database}" on ${c.host}:${c.port}`;
}

function explain(sequelize: Sequelize, err: unknown): MigrationFailedError {
  const name = err instanceof MigrationError ? err.migration.name : null;
  const cause = err instanceof MigrationError ? err.cause : err;
  const reason = cause instanceof Error ? cause.message : String(cause);
  const where = describeDatabase(sequelize);
  const sqlite = sequelize.getDialect() === "sqlite";
  return new MigrationFailedError(
    `${where} could not be brought up to date: migration ${name ?? "(before the first)"} failed: ${reason}. ` +
      (sqlite
        ? "Nothing of that migration was kept (each runs in one transaction). If the message says a table or index " +
          "already exists, an older version stopped halfway through it: if the file holds nothing you need (one " +
          "made by tests or a demo), delete it and start again; otherwise restore it from a backup."
        : "If the message says a table or index already exists, an earlier start stopped halfway through it: " +
          "restore the database from a backup, or drop what that migration created and start again."),
    name,
  );
}

/**
 * SQLite: each migration and its row in SequelizeMeta in one transaction, so a process killed or
 * failing halfway leaves the file as before that migration (DDL is transactional in SQLite).
 * Foreign keys are off meanwhile, as SQLite's own procedure for schema changes asks (a table rebuilt
 * by copying would otherwise cascade its deletes; "ALTER TABLE", sqlite.org/lang_altertable.html §7,
 * from memory), and checked before each commit. Every statement here runs on Sequelize's one
 * default connection (no `transaction` option), so BEGIN/COMMIT on it enclose the migration's own.
 */
async function migrateSqlite(sequelize: Sequelize, modules: MigrationModule[]): Promise<string[]> {
  const migrator = createMigrator(sequelize, modules);
  let open = false;
  migrator.on("migrating", async () => {
    await sequelize.query("BEGIN IMMEDIATE");
    open = true;
  });
  migrator.on("migrated", async ({ name }) => {
    const broken = await sequelize.query<{ table: string }>("PRAGMA foreign_key_check", { type: QueryTypes.SELECT });
    if (broken.length)
      throw new MigrationError(
        { direction: "up", name, context: sequelize.getQueryInterface() },
        new Error(`it left rows whose reference points nowhere (table ${broken[0].table})`),
      );
    await sequelize.query("COMMIT");
    open = false;
  });
  await sequelize.query("PRAGMA foreign_keys = OFF");
  let applied: string[];
  try {
    applied = (await migrator.up()).map((m) => m.name);
  } catch (err) {
    if (open) await sequelize.query("ROLLBACK");
    throw explain(sequelize, err);
  } finally {
    await sequelize.query("PRAGMA foreign_keys = ON");
  }
  await countChangesOfEveryTable(sequelize);
  return applied;
}

/**
 * Applies pending migrations; returns the names applied. On PostgreSQL several processes (web
 * servers, workers on other machines) may start at once against one database, and two of them
 * creating the same tables collide; a transaction-scoped advisory lock makes the others wait and
 * then find nothing pending. SQLite serves one machine; there each migration is atomic.
 * A failure is a MigrationFailedError naming the database, the migration and what to do.
 */
export async function migrateUp(
  sequelize: Sequelize,
  modules: MigrationModule[] = migrationModules,
): Promise<string[]> {
  if (sequelize.getDialect() !== "postgres") return migrateSqlite(sequelize, modules);
  try {
    return await sequelize.transaction(async (transaction) => {
      await sequelize.query(`SELECT pg_advisory_xact_lock(${MIGRATION_LOCK_KEY})`, { transaction });
      return (await createMigrator(sequelize, modules).up()).map((m) => m.name);
    });
  } catch (err) {
    throw explain(sequelize, err);
  }
}
