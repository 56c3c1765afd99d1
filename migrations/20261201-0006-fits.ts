/**
 * Fits: one kinetics (or several, compared) fitted to measured wavelengths. A fit row is written
 * with its background job in one transaction; its stored spec is the command line's FIT.json, so
 * `cli fit --spec` and the app mean the same thing. Results are immutable: a re-run is a new row
 * that points at the original (`rerun_of`).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

const at = { type: DataTypes.DATE, allowNull: false };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("fits", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    lab_id: { type: DataTypes.UUID, allowNull: false, references: { model: "labs", key: "id" }, onDelete: "CASCADE" },
    name: { type: DataTypes.STRING(200), allowNull: false },
    kind: { type: DataTypes.STRING(12), allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false },
    job_id: { type: DataTypes.UUID },
    spec: { type: DataTypes.JSON, allowNull: false },
    provenance: { type: DataTypes.JSON, allowNull: false },
    input_sha256: { type: DataTypes.STRING(64), allowNull: false },
    result: { type: DataTypes.JSON },
    error: { type: DataTypes.TEXT },
    software_version: { type: DataTypes.STRING(40), allowNull: false },
    rerun_of: { type: DataTypes.UUID, references: { model: "fits", key: "id" }, onDelete: "SET NULL" },
    created_by: { type: DataTypes.UUID, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
    created_at: at,
    updated_at: at,
  });
  await qi.addIndex("fits", ["lab_id", "created_at"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable("fits");
};
