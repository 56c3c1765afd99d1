import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A process that runs jobs: the web server's own worker ("web") or one of `npm run worker` ("worker"). */
export class Worker extends Model<InferAttributes<Worker>, InferCreationAttributes<Worker>> {
  /** host:pid:random, chosen by the process at start. */
  declare id: string;
  declare role: "web" | "worker";
  declare host: string;
  declare pid: number;
  /** How many jobs it runs at once. */
  declare concurrency: number;
  declare startedAt: Date;
  /** Its last heartbeat; a worker not seen for WORKER_STALE_AFTER_S is taken for stopped. */
  declare seenAt: Date;
}

export function initWorker(sequelize: Sequelize) {
  const M = class extends Worker {};
  M.init(
    {
      id: { type: DataTypes.STRING(80), primaryKey: true },
      role: { type: DataTypes.STRING(10), allowNull: false },
      host: { type: DataTypes.STRING(200), allowNull: false },
      pid: { type: DataTypes.INTEGER, allowNull: false },
      concurrency: { type: DataTypes.INTEGER, allowNull: false },
      startedAt: { type: DataTypes.DATE, allowNull: false },
      seenAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, modelName: "worker", tableName: "workers", underscored: true, timestamps: false },
  );
  return M;
}
