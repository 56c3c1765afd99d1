import "server-only";
import type { QueryInterface, Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";
import { migrationModules } from "@/migrations";

/** Any fixed number: the PostgreSQL advisory lock that lets one process migrate at a time. */
const MIGRATION_LOCK_KEY = 7_240_331;

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: migrationModules.map(({ name, module }) => ({
      name,
      up: (p) => module.up(p),
      down: (p) => module.down(p),
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

/**
 * Applies pending migrations; returns the names applied. On PostgreSQL several processes (web
 * servers, workers on other machines) may start at once against one database, and two of them
 * creating the same tables collide; a transaction-scoped advisory lock makes the others wait and
 * then find nothing pending. SQLite serves one machine, and its migrations run as before.
 */
export async function migrateUp(sequelize: Sequelize): Promise<string[]> {
  if (sequelize.getDialect() !== "postgres") return (await createMigrator(sequelize).up()).map((m) => m.name);
  return sequelize.transaction(async (transaction) => {
    await sequelize.query(`SELECT pg_advisory_xact_lock(${MIGRATION_LOCK_KEY})`, { transaction });
    return (await createMigrator(sequelize).up()).map((m) => m.name);
  });
}
