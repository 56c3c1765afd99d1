/**
 * Verification runs: a kinetics simulated from a stored run spec (the CLI's RUN.json), its
 * final pattern read by the tissue readout and compared with the linear prediction 2π/k*.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

const ref = (table: string, onDelete: "CASCADE" | "SET NULL", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
});

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("simulation_runs", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    lab_id: ref("labs", "CASCADE"),
    job_id: ref("jobs", "SET NULL", true),
    status: { type: DataTypes.STRING(12), allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    kinetics_kind: { type: DataTypes.STRING(10), allowNull: false },
    kinetics_ref: { type: DataTypes.STRING(64), allowNull: false },
    kinetics_version: { type: DataTypes.INTEGER },
    kinetics_name: { type: DataTypes.STRING(200), allowNull: false },
    spec: { type: DataTypes.JSON, allowNull: false },
    plan: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON },
    error: { type: DataTypes.TEXT },
    stop_reason: { type: DataTypes.STRING(12) },
    seed: { type: DataTypes.STRING(40), allowNull: false },
    wavelength_um: { type: DataTypes.FLOAT },
    uncertainty_um: { type: DataTypes.FLOAT },
    predicted_wavelength_um: { type: DataTypes.FLOAT },
    agrees: { type: DataTypes.BOOLEAN },
    file_keys: { type: DataTypes.JSON },
    software_version: { type: DataTypes.STRING(40), allowNull: false },
    created_by: ref("users", "SET NULL", true),
    created_at: { type: DataTypes.DATE, allowNull: false },
    finished_at: { type: DataTypes.DATE },
  });
  await qi.addIndex("simulation_runs", ["lab_id", "created_at"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable("simulation_runs");
};
