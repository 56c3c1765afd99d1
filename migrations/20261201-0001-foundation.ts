/**
 * Foundation tables: next-auth's users/accounts/sessions/verification_tokens, labs, memberships,
 * invitations, audit events, studies, specimens, uploads, API tokens.
 * Column names are snake_case (models use `underscored: true`).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false };
const createdAt = { type: DataTypes.DATE, allowNull: false };
const ref = (table: string, onDelete: "CASCADE" | "SET NULL" | "RESTRICT" = "CASCADE", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
});

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("users", {
    id,
    name: { type: DataTypes.STRING },
    email: { type: DataTypes.STRING, allowNull: false, unique: true },
    email_verified: { type: DataTypes.DATE },
    image: { type: DataTypes.STRING },
    password_hash: { type: DataTypes.STRING },
    notify_by_email: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE },
  });
  await qi.createTable("accounts", {
    id,
    type: { type: DataTypes.STRING, allowNull: false },
    provider: { type: DataTypes.STRING, allowNull: false },
    provider_account_id: { type: DataTypes.STRING, allowNull: false },
    refresh_token: { type: DataTypes.STRING },
    access_token: { type: DataTypes.STRING },
    expires_at: { type: DataTypes.INTEGER },
    token_type: { type: DataTypes.STRING },
    scope: { type: DataTypes.STRING },
    id_token: { type: DataTypes.TEXT },
    session_state: { type: DataTypes.STRING },
    user_id: ref("users"),
  });
  await qi.createTable("sessions", {
    id,
    expires: { type: DataTypes.DATE, allowNull: false },
    session_token: { type: DataTypes.STRING, allowNull: false, unique: true },
    user_id: ref("users"),
  });
  await qi.createTable("verification_tokens", {
    token: { type: DataTypes.STRING, primaryKey: true },
    identifier: { type: DataTypes.STRING, allowNull: false },
    expires: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable("labs", {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    created_by: ref("users", "SET NULL", true),
    created_at: createdAt,
    updated_at: createdAt,
  });
  await qi.createTable("memberships", {
    id,
    lab_id: ref("labs"),
    user_id: ref("users"),
    role: { type: DataTypes.STRING(20), allowNull: false },
    created_at: createdAt,
    updated_at: createdAt,
  });
  await qi.addIndex("memberships", ["lab_id", "user_id"], { unique: true });
  await qi.createTable("invitations", {
    id,
    lab_id: ref("labs"),
    email: { type: DataTypes.STRING, allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by: ref("users", "SET NULL", true),
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE },
    revoked_at: { type: DataTypes.DATE },
    created_at: createdAt,
    updated_at: createdAt,
  });
  await qi.addIndex("invitations", ["lab_id"]);
  await qi.createTable("audit_events", {
    id,
    lab_id: ref("labs"),
    actor_id: ref("users", "SET NULL", true),
    actor_email: { type: DataTypes.STRING },
    action: { type: DataTypes.STRING(60), allowNull: false },
    target_type: { type: DataTypes.STRING(40), allowNull: false },
    target_id: { type: DataTypes.STRING(64) },
    summary: { type: DataTypes.STRING(500), allowNull: false },
    details: { type: DataTypes.JSON },
    created_at: createdAt,
  });
  await qi.addIndex("audit_events", ["lab_id", "created_at"]);
  await qi.createTable("studies", {
    id,
    lab_id: ref("labs"),
    name: { type: DataTypes.STRING(200), allowNull: false },
    tissue: { type: DataTypes.STRING(120), allowNull: false },
    organism: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT },
    created_by: ref("users", "SET NULL", true),
    created_at: createdAt,
    updated_at: createdAt,
  });
  await qi.addIndex("studies", ["lab_id"]);
  await qi.createTable("specimens", {
    id,
    lab_id: ref("labs"),
    study_id: ref("studies"),
    label: { type: DataTypes.STRING(120), allowNull: false },
    condition: { type: DataTypes.STRING(120), allowNull: false },
    stage: { type: DataTypes.STRING(60) },
    genotype: { type: DataTypes.STRING(120) },
    notes: { type: DataTypes.TEXT },
    created_by: ref("users", "SET NULL", true),
    created_at: createdAt,
    updated_at: createdAt,
  });
  await qi.addIndex("specimens", ["study_id"]);
  await qi.createTable("uploads", {
    id,
    lab_id: ref("labs"),
    specimen_id: ref("specimens", "RESTRICT"),
    filename: { type: DataTypes.STRING(255), allowNull: false },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(300), allowNull: false, unique: true },
    pixel_size_um: { type: DataTypes.FLOAT },
    pixel_size_source: { type: DataTypes.STRING(20) },
    created_by: ref("users", "SET NULL", true),
    created_at: createdAt,
  });
  await qi.addIndex("uploads", ["specimen_id"]);
  await qi.createTable("api_tokens", {
    id,
    user_id: ref("users"),
    name: { type: DataTypes.STRING(80), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    last_used_at: { type: DataTypes.DATE },
    revoked_at: { type: DataTypes.DATE },
    created_at: createdAt,
  });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of [
    "api_tokens",
    "uploads",
    "specimens",
    "studies",
    "audit_events",
    "invitations",
    "memberships",
    "labs",
    "verification_tokens",
    "sessions",
    "accounts",
    "users",
  ]) {
    await qi.dropTable(t);
  }
};
