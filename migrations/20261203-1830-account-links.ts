/**
 * One-time links of an account that are not a sign-in: a password reset, and the confirmation of a
 * new e-mail address (sent to that address). Only the SHA-256 of a link's token is stored.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("account_links", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    // "password-reset" or "email-change"
    kind: { type: DataTypes.STRING(30), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    // The address to change to (e-mail change only).
    new_email: { type: DataTypes.STRING, allowNull: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("account_links", ["user_id", "kind"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable("account_links");
};
