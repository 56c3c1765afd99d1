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
 * A verification run: one kinetics (catalogue id, or a lab kinetics at one version) simulated
 * from `spec` — exactly the RUN.json the `simulate` CLI reads — with `plan` holding what was
 * checked and predicted before the job started (step, steady state, 2π/k*, warnings).
 * Immutable once finished; the headline numbers are columns so lists can show them.
 */
export class SimulationRun extends Model<InferAttributes<SimulationRun>, InferCreationAttributes<SimulationRun>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare jobId: string | null;
  declare status: JobStatus;
  declare name: string;
  /** `catalogue` or `lab` */
  declare kineticsKind: string;
  /** Catalogue id or lab kinetics id. */
  declare kineticsRef: string;
  declare kineticsVersion: number | null;
  declare kineticsName: string;
  declare spec: Record<string, unknown>;
  declare plan: Record<string, unknown>;
  declare result: CreationOptional<Record<string, unknown> | null>;
  declare error: CreationOptional<string | null>;
  /** end-time | stationary | cancelled | blow-up (the solver's stop reason). */
  declare stopReason: CreationOptional<string | null>;
  declare seed: string;
  /** Readout of the final pattern (µm when a length scale is known, else model length). */
  declare wavelengthUm: CreationOptional<number | null>;
  declare uncertaintyUm: CreationOptional<number | null>;
  /** Linear prediction 2π/k*, same units as wavelengthUm. */
  declare predictedWavelengthUm: number | null;
  declare agrees: CreationOptional<boolean | null>;
  declare fileKeys: CreationOptional<Record<string, string> | null>;
  declare softwareVersion: string;
  /** The run whose filled-in form this one was changed from ("Change and run again"). */
  declare changedFrom: CreationOptional<string | null>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare finishedAt: CreationOptional<Date | null>;
}

export function initSimulationRun(sequelize: Sequelize) {
  const M = class extends SimulationRun {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      jobId: { type: DataTypes.UUID },
      status: { type: DataTypes.STRING(12), allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      kineticsKind: { type: DataTypes.STRING(10), allowNull: false },
      kineticsRef: { type: DataTypes.STRING(64), allowNull: false },
      kineticsVersion: { type: DataTypes.INTEGER },
      kineticsName: { type: DataTypes.STRING(200), allowNull: false },
      spec: { type: DataTypes.JSON, allowNull: false },
      plan: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON },
      error: { type: DataTypes.TEXT },
      stopReason: { type: DataTypes.STRING(12) },
      seed: { type: DataTypes.STRING(40), allowNull: false },
      wavelengthUm: { type: DataTypes.FLOAT },
      uncertaintyUm: { type: DataTypes.FLOAT },
      predictedWavelengthUm: { type: DataTypes.FLOAT },
      agrees: { type: DataTypes.BOOLEAN },
      fileKeys: { type: DataTypes.JSON },
      softwareVersion: { type: DataTypes.STRING(40), allowNull: false },
      changedFrom: { type: DataTypes.UUID },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      finishedAt: { type: DataTypes.DATE },
    },
    { sequelize, modelName: "simulationRun", tableName: "simulation_runs", underscored: true, updatedAt: false },
  );
  return M;
}
