/**
 * The one composition root: database, object storage and mail are chosen here, once, from
 * configuration. Nothing else constructs a client. Tests call `setServicesForTest` with their own.
 */
import { createS3ObjectStore } from "@/storage/s3-object-store";
import type { ObjectStore } from "@/storage/object-store";
import { readConfig, type Config } from "./config";
import { createDatabase, type Database } from "./db";
import { createSmtpMailer, type Mailer } from "./mail";

export interface Services {
  config: Config;
  db: Database;
  store: ObjectStore;
  mailer: Mailer;
}

const g = globalThis as unknown as { __morphokinServices?: Services };

export function createServices(config: Config = readConfig()): Services {
  return {
    config,
    db: createDatabase(config.databaseUrl || config.databasePath, { writeWaitMs: config.dbWriteWaitMs }),
    store: createS3ObjectStore(config.s3),
    mailer: createSmtpMailer(config.smtp),
  };
}

export function services(): Services {
  return (g.__morphokinServices ??= createServices());
}

/** Ready database + models; every data-access function starts here. */
export async function database() {
  const s = services();
  await s.db.ready;
  return s.db.models;
}

export function setServicesForTest(s: Services | undefined) {
  g.__morphokinServices = s;
}
