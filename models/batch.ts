import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/**
 * Where a batch's files go: `specimen` (all are images of one existing specimen),
 * `specimen-per-file` (a new specimen per file in a study, named from the file name),
 * `one-specimen` (one new specimen in a study for all files; `specimenId` is that specimen).
 */
export type BatchTarget = "specimen" | "specimen-per-file" | "one-specimen";

/** Many files uploaded at once, with the settings chosen once for all of them. */
export class Batch extends Model<InferAttributes<Batch>, InferCreationAttributes<Batch>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare name: string;
  declare target: BatchTarget;
  declare studyId: string | null;
  declare specimenId: string | null;
  /** Condition and stage of the specimens a `specimen-per-file` batch creates. */
  declare condition: string | null;
  declare stage: string | null;
  /** µm/px for files without their own pixel size (or for every file when `pixelSizeOverride`). */
  declare pixelSizeUm: number | null;
  declare pixelSizeOverride: CreationOptional<boolean>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
}

/** A file of a batch refused at upload: no upload exists, so its name and reason live here. */
export class BatchRejection extends Model<InferAttributes<BatchRejection>, InferCreationAttributes<BatchRejection>> {
  declare id: CreationOptional<string>;
  declare batchId: string;
  declare filename: string;
  declare message: string;
  declare createdAt: CreationOptional<Date>;
}

export function initBatch(sequelize: Sequelize) {
  const M = class extends Batch {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      target: { type: DataTypes.STRING(20), allowNull: false },
      studyId: { type: DataTypes.UUID },
      specimenId: { type: DataTypes.UUID },
      condition: { type: DataTypes.STRING(120) },
      stage: { type: DataTypes.STRING(60) },
      pixelSizeUm: { type: DataTypes.FLOAT },
      pixelSizeOverride: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "batch", tableName: "batches", underscored: true, updatedAt: false },
  );
  return M;
}

export function initBatchRejection(sequelize: Sequelize) {
  const M = class extends BatchRejection {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      batchId: { type: DataTypes.UUID, allowNull: false },
      filename: { type: DataTypes.STRING(255), allowNull: false },
      message: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "batchRejection", tableName: "batch_rejections", underscored: true, updatedAt: false },
  );
  return M;
}
