/** `npm run db:migrate`: applies pending migrations to the configured database (DATABASE_URL, else the SQLite file). */
import { readConfig } from "@/lib/server/config";
import { createDatabase, describeLocation } from "@/lib/server/db";
import { migrateUp } from "@/lib/server/migrate";

async function main() {
  const config = readConfig();
  const location = config.databaseUrl || config.databasePath;
  const db = createDatabase(location, { migrate: false });
  await db.ready;
  const applied = await migrateUp(db.sequelize);
  process.stdout.write(
    applied.length ? `applied: ${applied.join(", ")}\n` : `database ${describeLocation(location)} is up to date\n`,
  );
  await db.sequelize.close();
}

main().catch((err) => {
  process.stderr.write(`migration failed: ${err instanceof Error ? err.message : err}\n`);
  process.exit(1);
});
