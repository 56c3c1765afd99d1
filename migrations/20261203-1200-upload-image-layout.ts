/**
 * Uploads of images keep what their headers say about the file: size, bit depth, channels,
 * z-planes, time points (multi-page TIFF, OME-TIFF) and any problem found in the stack's
 * description. A readout's channel, plane and time point are checked against it before queueing.
 * Null for tables and for uploads made before this column.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn("uploads", "image_layout", { type: DataTypes.JSON, allowNull: true });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  // See 20261203-0020-upload-state.ts: SQLite drops a column by copying the table.
  const sqlite = qi.sequelize.getDialect() === "sqlite";
  if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = OFF");
  try {
    await qi.removeColumn("uploads", "image_layout");
  } finally {
    if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = ON");
  }
};
