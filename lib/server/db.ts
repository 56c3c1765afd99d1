/**
 * One Sequelize instance (SQLite via sqlite3) per process, with its models and migrations applied.
 * WAL mode, a busy timeout and foreign keys are set on the connection.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { Sequelize } from "sequelize";
import sqlite3 from "sqlite3";
import { createModels, type Models } from "@/models";
import { migrateUp } from "./migrate";

export interface Database {
  sequelize: Sequelize;
  models: Models;
  /** Resolves once pragmas are set and migrations are applied. */
  ready: Promise<void>;
}

export function createDatabase(storage: string, options: { migrate?: boolean } = {}): Database {
  if (storage !== ":memory:") mkdirSync(path.dirname(storage), { recursive: true });
  const sequelize = new Sequelize({ dialect: "sqlite", storage, dialectModule: sqlite3, logging: false });
  const models = createModels(sequelize);
  const ready = (async () => {
    if (storage !== ":memory:") await sequelize.query("PRAGMA journal_mode = WAL;");
    await sequelize.query("PRAGMA busy_timeout = 5000;");
    await sequelize.query("PRAGMA foreign_keys = ON;");
    if (options.migrate !== false) await migrateUp(sequelize);
  })();
  return { sequelize, models, ready };
}
