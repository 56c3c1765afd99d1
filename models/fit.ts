import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { JobStatus } from "./job";

/**
 * A fit of one kinetics — or a comparison of several — to measured wavelengths. `spec` is the
 * command line's FIT.json; `provenance` records where every datum came from (readout ids and
 * input hashes), the kinetics versions and the settings. `result` exists only when succeeded.
 */
export class Fit extends Model<InferAttributes<Fit>, InferCreationAttributes<Fit>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare name: string;
  /** `fit` (one kinetics) or `comparison` (several on the same data) */
  declare kind: string;
  declare status: JobStatus;
  declare jobId: string | null;
  declare spec: Record<string, unknown>;
  declare provenance: Record<string, unknown>;
  /** SHA-256 of the stored spec (canonical JSON). */
  declare inputSha256: string;
  declare result: CreationOptional<Record<string, unknown> | null>;
  declare error: CreationOptional<string | null>;
  /**
   * What lists show of the fit (lib/server/fits/fits.ts, fitSummaryOf): kinetics, conditions and
   * data count from its creation, best model and verdict once it succeeds; null for fits made
   * before this column.
   */
  declare summary: CreationOptional<Record<string, unknown> | null>;
  declare softwareVersion: string;
  declare rerunOf: string | null;
  /** The fit whose filled-in builder this one was changed from ("Change and re-run"). */
  declare changedFrom: CreationOptional<string | null>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initFit(sequelize: Sequelize) {
  const M = class extends Fit {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      kind: { type: DataTypes.STRING(12), allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false },
      jobId: { type: DataTypes.UUID },
      spec: { type: DataTypes.JSON, allowNull: false },
      provenance: { type: DataTypes.JSON, allowNull: false },
      inputSha256: { type: DataTypes.STRING(64), allowNull: false },
      result: { type: DataTypes.JSON },
      error: { type: DataTypes.TEXT },
      summary: { type: DataTypes.JSON },
      softwareVersion: { type: DataTypes.STRING(40), allowNull: false },
      rerunOf: { type: DataTypes.UUID },
      changedFrom: { type: DataTypes.UUID },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "fit", tableName: "fits", underscored: true },
  );
  return M;
}
