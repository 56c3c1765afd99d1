/**
 * Discussions: comment threads on any lab object (readouts, fits, uploads; the kind is a word,
 * not a foreign key, so new kinds need no schema change), and their comments with one level of
 * replies. A deleted comment keeps its row as a placeholder so the replies under it still read.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationFn } from "umzug";

const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false };
const at = { type: DataTypes.DATE, allowNull: false };
const ref = (table: string, onDelete: "CASCADE" | "SET NULL" | "RESTRICT" = "CASCADE", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
});

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable("comment_threads", {
    id,
    lab_id: ref("labs"),
    target_type: { type: DataTypes.STRING(20), allowNull: false },
    target_id: { type: DataTypes.UUID, allowNull: false },
    status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "open" },
    created_by: ref("users", "SET NULL", true),
    resolved_by: ref("users", "SET NULL", true),
    resolved_at: { type: DataTypes.DATE },
    last_activity_at: at,
    created_at: at,
    updated_at: at,
  });
  await qi.addIndex("comment_threads", ["lab_id", "target_type", "target_id"]);
  await qi.addIndex("comment_threads", ["lab_id", "status", "last_activity_at"]);

  await qi.createTable("comments", {
    id,
    lab_id: ref("labs"),
    thread_id: ref("comment_threads"),
    parent_id: ref("comments", "SET NULL", true),
    author_id: ref("users", "SET NULL", true),
    body: { type: DataTypes.TEXT, allowNull: false },
    body_html: { type: DataTypes.TEXT, allowNull: false },
    mentions: { type: DataTypes.JSON, allowNull: false },
    edited_at: { type: DataTypes.DATE },
    deleted_at: { type: DataTypes.DATE },
    deleted_by: ref("users", "SET NULL", true),
    created_at: at,
  });
  await qi.addIndex("comments", ["thread_id", "created_at"]);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of ["comments", "comment_threads"]) await qi.dropTable(t);
};
