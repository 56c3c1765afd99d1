/**
 * Jobs count how often a server stop interrupted them (re-queued once, failed the second time);
 * API tokens get an optional expiry and remember when their expiry was written to the audit
 * trail; account-level audit events (sign-ins, API tokens) that belong to no lab get a table.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn("jobs", "restarts", { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await qi.addColumn("api_tokens", "expires_at", { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn("api_tokens", "expiry_recorded_at", { type: DataTypes.DATE, allowNull: true });
  await qi.createTable("account_events", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    // Null for a failed sign-in with an address that has no account.
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    email: { type: DataTypes.STRING, allowNull: true },
    action: { type: DataTypes.STRING(60), allowNull: false },
    summary: { type: DataTypes.STRING(500), allowNull: false },
    details: { type: DataTypes.JSON },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("account_events", ["user_id", "created_at"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable("account_events");
  await qi.removeColumn("api_tokens", "expiry_recorded_at");
  await qi.removeColumn("api_tokens", "expires_at");
  await qi.removeColumn("jobs", "restarts");
};
