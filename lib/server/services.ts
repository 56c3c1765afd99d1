/**
 * The one composition root: database, object storage, mail and job delivery are chosen here,
 * once, from configuration (job handlers are mapped to kinds in lib/server/jobs/wiring.ts).
 * Nothing else constructs a client. Tests call `setServicesForTest` with their own.
 */
import "server-only";
import { createS3ObjectStore } from "@/storage/s3-object-store";
import type { ObjectStore } from "@/storage/object-store";
import { readConfig, type Config } from "./config";
import { createDatabase, isPostgresUrl, type Database } from "./db";
import { createSmtpMailer, type Mailer } from "./mail";
import { createInProcessDelivery, type JobDelivery } from "./jobs/delivery";
import { createPgBossDelivery } from "./jobs/pg-boss-delivery";

export interface Services {
  config: Config;
  db: Database;
  store: ObjectStore;
  mailer: Mailer;
  /** How queued jobs reach a worker (lib/server/jobs/delivery.ts). */
  jobs: JobDelivery;
}

const g = globalThis as unknown as { __morphokinServices?: Services; __morphokinServicesClosed?: boolean };

export function createServices(config: Config = readConfig()): Services {
  return {
    config,
    db: createDatabase(config.databaseUrl || config.databasePath, { writeWaitMs: config.dbWriteWaitMs }),
    store: createS3ObjectStore(config.s3),
    mailer: createSmtpMailer(config.smtp),
    // On PostgreSQL jobs go through pg-boss in the same database; on the SQLite file, in-process.
    jobs: isPostgresUrl(config.databaseUrl) ? createPgBossDelivery(config.databaseUrl) : createInProcessDelivery(),
  };
}

export function services(): Services {
  if (g.__morphokinServices) return g.__morphokinServices;
  // A test closed its stack while work of it still ran (a hook that timed out, a late promise):
  // falling back to the configured default would open, and start migrating, the developer's own
  // storage/data/morphokin.sqlite, which the test process then leaves half-migrated when it exits.
  if (g.__morphokinServicesClosed)
    throw new Error("the services of this test were closed; work that outlived its test stack stops here");
  return (g.__morphokinServices = createServices());
}

/** Ready database + models; every data-access function starts here. */
export async function database() {
  const s = services();
  await s.db.ready;
  return s.db.models;
}

/** `undefined` closes them: later calls throw instead of opening the configured default database. */
export function setServicesForTest(s: Services | undefined) {
  g.__morphokinServices = s;
  g.__morphokinServicesClosed = s === undefined;
}
