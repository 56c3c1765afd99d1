/**
 * Change and re-run: a fit or a verification run started from the filled-in form of an earlier
 * one records which one it was changed from (`changed_from`), so both pages link to each other.
 * The earlier row is never changed (results are immutable); deleting it leaves the link empty.
 * An exact re-run of a fit keeps using `fits.rerun_of`.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

const selfRef = (table: string) => ({
  type: DataTypes.UUID,
  allowNull: true,
  references: { model: table, key: "id" },
  onDelete: "SET NULL",
});

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn("fits", "changed_from", selfRef("fits"));
  await qi.addIndex("fits", ["changed_from"]);
  await qi.addColumn("simulation_runs", "changed_from", selfRef("simulation_runs"));
  await qi.addIndex("simulation_runs", ["changed_from"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex("simulation_runs", ["changed_from"]);
  await qi.removeIndex("fits", ["changed_from"]);
  // As in 20261203-0020: SQLite drops a column by copying the table; keep foreign keys off meanwhile.
  const sqlite = qi.sequelize.getDialect() === "sqlite";
  if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = OFF");
  try {
    await qi.removeColumn("simulation_runs", "changed_from");
    await qi.removeColumn("fits", "changed_from");
  } finally {
    if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = ON");
  }
};
