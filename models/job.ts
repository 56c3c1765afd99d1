import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export type JobStatus = "queued" | "running" | "succeeded" | "failed" | "cancelled";

/** A background job (readout, fit, comparison, simulation) behind one job interface. */
export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare kind: string;
  declare status: JobStatus;
  /** 0..1 */
  declare progress: CreationOptional<number>;
  declare progressNote: CreationOptional<string | null>;
  declare payload: Record<string, unknown>;
  declare result: CreationOptional<Record<string, unknown> | null>;
  declare error: CreationOptional<string | null>;
  declare requestedBy: string | null;
  /** How often a server stop interrupted this job while it ran (re-queued once, then failed). */
  declare restarts: CreationOptional<number>;
  /** The worker (a row of `workers`) running it; null while queued or for rows of older versions. */
  declare workerId: CreationOptional<string | null>;
  /** Set when a cancellation was asked for; the worker running the job stops it. */
  declare cancelRequestedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
}

export function initJob(sequelize: Sequelize) {
  const M = class extends Job {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false },
      progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      progressNote: { type: DataTypes.STRING(200) },
      payload: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON },
      error: { type: DataTypes.TEXT },
      requestedBy: { type: DataTypes.UUID },
      restarts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      workerId: { type: DataTypes.STRING(80) },
      cancelRequestedAt: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
      startedAt: { type: DataTypes.DATE },
      finishedAt: { type: DataTypes.DATE },
    },
    { sequelize, modelName: "job", tableName: "jobs", underscored: true, updatedAt: false },
  );
  return M;
}
