/**
 * Jobs may run in several worker processes: a job row names the worker running it and records a
 * cancellation asked for from another process; each worker (the web server's own included) keeps
 * a row with a heartbeat, so a job of a worker that stopped is recognised and taken up again.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn("jobs", "worker_id", { type: DataTypes.STRING(80), allowNull: true });
  await qi.addColumn("jobs", "cancel_requested_at", { type: DataTypes.DATE, allowNull: true });
  await qi.createTable("workers", {
    id: { type: DataTypes.STRING(80), primaryKey: true, allowNull: false },
    // "web": the web server's own worker; "worker": a process of `npm run worker`.
    role: { type: DataTypes.STRING(10), allowNull: false },
    host: { type: DataTypes.STRING(200), allowNull: false },
    pid: { type: DataTypes.INTEGER, allowNull: false },
    concurrency: { type: DataTypes.INTEGER, allowNull: false },
    started_at: { type: DataTypes.DATE, allowNull: false },
    seen_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable("workers");
  await qi.removeColumn("jobs", "cancel_requested_at");
  await qi.removeColumn("jobs", "worker_id");
};
