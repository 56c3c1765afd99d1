/**
 * Rate-limit counters (one row per limited key, shared by every web process) and sign-up
 * requests waiting for their e-mailed confirmation link (the account is created only then).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("rate_limits", {
    key: { type: DataTypes.STRING(300), primaryKey: true, allowNull: false },
    count: { type: DataTypes.INTEGER, allowNull: false },
    /** Epoch milliseconds: plain integers keep the one-statement upsert portable. */
    window_started_ms: { type: DataTypes.BIGINT, allowNull: false },
    locked_until_ms: { type: DataTypes.BIGINT },
  });
  await qi.createTable("signup_requests", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    email: { type: DataTypes.STRING, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    lab_name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING, allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("signup_requests", ["email"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable("signup_requests");
  await qi.dropTable("rate_limits");
};
