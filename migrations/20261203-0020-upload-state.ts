/**
 * Uploads get a state: "receiving" while the original is being put into object storage (the
 * row is written first, hidden from lists and readouts), "stored" once it is there. A row still
 * "receiving" after the grace period belongs to an upload that never finished; the sweep
 * (lib/server/upload-recovery.ts) removes it with its object. Existing rows are all stored.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn("uploads", "state", { type: DataTypes.STRING(10), allowNull: false, defaultValue: "stored" });
  await qi.addIndex("uploads", ["state", "created_at"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex("uploads", ["state", "created_at"]);
  // SQLite drops a column by copying the table and dropping the old one; with foreign keys on,
  // that drop would cascade to every readout of every upload. (PostgreSQL drops it in place.)
  const sqlite = qi.sequelize.getDialect() === "sqlite";
  if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = OFF");
  try {
    await qi.removeColumn("uploads", "state");
  } finally {
    if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = ON");
  }
};
