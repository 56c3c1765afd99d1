/**
 * One Sequelize instance (SQLite via sqlite3) per process, with its models and migrations applied.
 * WAL mode and foreign keys are set on the connection; every connection waits up to
 * BUSY_TIMEOUT_MS for another's write lock (Sequelize opens one sqlite3 connection per
 * transaction, and a PRAGMA on the default connection would not reach those).
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { Sequelize, Transaction } from "sequelize";
import sqlite3 from "sqlite3";
import { createModels, type Models } from "@/models";
import { migrateUp } from "./migrate";

export interface Database {
  sequelize: Sequelize;
  models: Models;
  /** Resolves once pragmas are set and migrations are applied. */
  ready: Promise<void>;
}

/** How long a connection waits for another connection's write lock before SQLITE_BUSY (ms). */
export const BUSY_TIMEOUT_MS = 5000;

/** sqlite3 whose every Database (one per Sequelize transaction) waits for locks. */
class BusyWaitingDatabase extends sqlite3.Database {
  constructor(filename: string, mode?: number, callback?: (err: Error | null) => void) {
    super(filename, mode as number, callback);
    this.configure("busyTimeout", BUSY_TIMEOUT_MS);
  }
}
const dialectModule = { ...sqlite3, Database: BusyWaitingDatabase };

export function createDatabase(storage: string, options: { migrate?: boolean } = {}): Database {
  if (storage !== ":memory:") mkdirSync(path.dirname(storage), { recursive: true });
  // IMMEDIATE: a transaction takes the write lock when it begins. A deferred one that read first
  // and writes later fails with SQLITE_BUSY, whatever the timeout, when another connection wrote in
  // between (a stale read snapshot cannot be upgraded to a write; SQLite docs, "Transaction",
  // lang_transaction.html, from memory); with IMMEDIATE it waits its turn. The test
  // tests/api/db-concurrency.test.ts fails with DEFERRED.
  const sequelize = new Sequelize({ dialect: "sqlite", storage, dialectModule, logging: false, transactionType: Transaction.TYPES.IMMEDIATE });
  const models = createModels(sequelize);
  const ready = (async () => {
    if (storage !== ":memory:") await sequelize.query("PRAGMA journal_mode = WAL;");
    await sequelize.query("PRAGMA foreign_keys = ON;");
    if (options.migrate !== false) await migrateUp(sequelize);
  })();
  return { sequelize, models, ready };
}
