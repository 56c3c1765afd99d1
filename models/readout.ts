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
 * A spacing readout of one upload with one set of settings. Immutable once finished: other
 * settings make a new readout, so history is kept. `result` holds the full result object;
 * the headline numbers are columns so lists and comparisons can query them.
 */
export class Readout extends Model<InferAttributes<Readout>, InferCreationAttributes<Readout>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare uploadId: string;
  declare specimenId: string;
  declare jobId: string | null;
  declare status: JobStatus;
  /** `image` or `table` */
  declare kind: string;
  declare settings: Record<string, unknown>;
  declare result: CreationOptional<Record<string, unknown> | null>;
  declare error: CreationOptional<string | null>;
  /** Fourier wavelength, µm (for tables: the summary the settings ask for). */
  declare wavelengthUm: CreationOptional<number | null>;
  declare uncertaintyUm: CreationOptional<number | null>;
  declare periodFound: CreationOptional<boolean | null>;
  declare pixelSizeUm: number | null;
  declare inputSha256: string;
  declare softwareVersion: string;
  /** Object keys of derived products: spectrum JSON, preview and FFT PNGs. */
  declare derivedKeys: CreationOptional<Record<string, string> | null>;
  /**
   * What lists show of the result (lib/server/readouts/result.ts, headlineOf), written with it;
   * null until it succeeds, and for readouts finished before this column.
   */
  declare headline: CreationOptional<Record<string, unknown> | null>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initReadout(sequelize: Sequelize) {
  const M = class extends Readout {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      uploadId: { type: DataTypes.UUID, allowNull: false },
      specimenId: { type: DataTypes.UUID, allowNull: false },
      jobId: { type: DataTypes.UUID },
      status: { type: DataTypes.STRING(12), allowNull: false },
      kind: { type: DataTypes.STRING(10), allowNull: false },
      settings: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON },
      error: { type: DataTypes.TEXT },
      wavelengthUm: { type: DataTypes.FLOAT },
      uncertaintyUm: { type: DataTypes.FLOAT },
      periodFound: { type: DataTypes.BOOLEAN },
      pixelSizeUm: { type: DataTypes.FLOAT },
      inputSha256: { type: DataTypes.STRING(64), allowNull: false },
      softwareVersion: { type: DataTypes.STRING(40), allowNull: false },
      derivedKeys: { type: DataTypes.JSON },
      headline: { type: DataTypes.JSON },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "readout", tableName: "readouts", underscored: true, updatedAt: false },
  );
  return M;
}
