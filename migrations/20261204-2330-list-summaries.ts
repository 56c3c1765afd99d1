/**
 * What a list shows of a readout or a fit, kept beside the full object: a readout's headline
 * (measure, wavelength, uncertainty, symmetry …) and a fit's summary (kinetics, conditions, data
 * count, best model, verdict). A list then reads a few hundred bytes per row instead of parsing
 * each full result (a fit's result and provenance are tens of kB). Null for rows written before
 * this column: lists read the full columns for those (readouts.ts, fits.ts).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn("readouts", "headline", { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn("fits", "summary", { type: DataTypes.JSON, allowNull: true });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  // See 20261203-0020-upload-state.ts: SQLite drops a column by copying the table.
  const sqlite = qi.sequelize.getDialect() === "sqlite";
  if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = OFF");
  try {
    await qi.removeColumn("fits", "summary");
    await qi.removeColumn("readouts", "headline");
  } finally {
    if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = ON");
  }
};
