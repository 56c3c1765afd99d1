/**
 * The lab's own kinetics (versioned: a fit records exactly the version it used), background jobs,
 * and spacing readouts (immutable: new settings make a new readout).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false };
const at = { type: DataTypes.DATE, allowNull: false };
const ref = (table: string, onDelete: "CASCADE" | "SET NULL" | "RESTRICT" = "CASCADE", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
});

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("lab_kinetics", {
    id,
    lab_id: ref("labs"),
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT },
    latest_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_by: ref("users", "SET NULL", true),
    created_at: at,
    updated_at: at,
  });
  await qi.addIndex("lab_kinetics", ["lab_id"]);
  await qi.createTable("kinetics_versions", {
    id,
    kinetics_id: ref("lab_kinetics"),
    lab_id: ref("labs"),
    version: { type: DataTypes.INTEGER, allowNull: false },
    definition: { type: DataTypes.JSON, allowNull: false },
    created_by: ref("users", "SET NULL", true),
    created_at: at,
  });
  await qi.addIndex("kinetics_versions", ["kinetics_id", "version"], { unique: true });

  await qi.createTable("jobs", {
    id,
    lab_id: ref("labs"),
    kind: { type: DataTypes.STRING(40), allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false },
    progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    progress_note: { type: DataTypes.STRING(200) },
    payload: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON },
    error: { type: DataTypes.TEXT },
    requested_by: ref("users", "SET NULL", true),
    created_at: at,
    started_at: { type: DataTypes.DATE },
    finished_at: { type: DataTypes.DATE },
  });
  await qi.addIndex("jobs", ["status", "created_at"]);
  await qi.addIndex("jobs", ["lab_id", "created_at"]);

  await qi.createTable("readouts", {
    id,
    lab_id: ref("labs"),
    upload_id: ref("uploads", "RESTRICT"),
    specimen_id: ref("specimens", "RESTRICT"),
    job_id: ref("jobs", "SET NULL", true),
    status: { type: DataTypes.STRING(12), allowNull: false },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    settings: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON },
    error: { type: DataTypes.TEXT },
    wavelength_um: { type: DataTypes.FLOAT },
    uncertainty_um: { type: DataTypes.FLOAT },
    period_found: { type: DataTypes.BOOLEAN },
    pixel_size_um: { type: DataTypes.FLOAT },
    input_sha256: { type: DataTypes.STRING(64), allowNull: false },
    software_version: { type: DataTypes.STRING(40), allowNull: false },
    derived_keys: { type: DataTypes.JSON },
    created_by: ref("users", "SET NULL", true),
    created_at: at,
  });
  await qi.addIndex("readouts", ["upload_id"]);
  await qi.addIndex("readouts", ["specimen_id"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of ["readouts", "jobs", "kinetics_versions", "lab_kinetics"]) await qi.dropTable(t);
};
