/**
 * Batches: many files uploaded at once to one specimen or to a study, reopened later as one
 * summary. A batch row says where its files went and with which settings; each stored upload of
 * it points at it (`uploads.batch_id`); a file refused at upload leaves no upload, only a
 * `batch_rejections` row with its name and the reason, so the summary still lists it.
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
  await qi.createTable("batches", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    lab_id: ref("labs", "CASCADE"),
    name: { type: DataTypes.STRING(200), allowNull: false },
    // "specimen": every file is an image of one existing specimen; "specimen-per-file": a new
    // specimen per file in a study; "one-specimen": one new specimen in a study for all files.
    target: { type: DataTypes.STRING(20), allowNull: false },
    study_id: ref("studies", "SET NULL", true),
    specimen_id: ref("specimens", "SET NULL", true),
    condition: { type: DataTypes.STRING(120) },
    stage: { type: DataTypes.STRING(60) },
    pixel_size_um: { type: DataTypes.FLOAT },
    pixel_size_override: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_by: ref("users", "SET NULL", true),
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("batches", ["lab_id", "created_at"]);
  await qi.createTable("batch_rejections", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    batch_id: ref("batches", "CASCADE"),
    filename: { type: DataTypes.STRING(255), allowNull: false },
    message: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("batch_rejections", ["batch_id"]);
  await qi.addColumn("uploads", "batch_id", ref("batches", "SET NULL", true));
  await qi.addIndex("uploads", ["batch_id"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex("uploads", ["batch_id"]);
  // As in 20261203-0020: SQLite drops a column by copying the table; keep foreign keys off meanwhile.
  const sqlite = qi.sequelize.getDialect() === "sqlite";
  if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = OFF");
  try {
    await qi.removeColumn("uploads", "batch_id");
  } finally {
    if (sqlite) await qi.sequelize.query("PRAGMA foreign_keys = ON");
  }
  await qi.dropTable("batch_rejections");
  await qi.dropTable("batches");
};
