import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/**
 * One comment in a thread. `body` is what the author typed (plain text with a little markdown);
 * `bodyHtml` is its sanitised rendering, made on the server when the body is saved. A deleted
 * comment keeps its row with an empty body (`deletedAt` set) so replies under it still make sense.
 */
export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare threadId: string;
  /** The comment this one replies to (always a top-level comment: one level of nesting). */
  declare parentId: string | null;
  declare authorId: string | null;
  declare body: string;
  declare bodyHtml: string;
  /** User ids of the lab members the body mentions. */
  declare mentions: string[];
  declare editedAt: CreationOptional<Date | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare deletedBy: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initComment(sequelize: Sequelize) {
  const M = class extends Comment {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      threadId: { type: DataTypes.UUID, allowNull: false },
      parentId: { type: DataTypes.UUID },
      authorId: { type: DataTypes.UUID },
      body: { type: DataTypes.TEXT, allowNull: false },
      bodyHtml: { type: DataTypes.TEXT, allowNull: false },
      mentions: { type: DataTypes.JSON, allowNull: false },
      editedAt: { type: DataTypes.DATE },
      deletedAt: { type: DataTypes.DATE },
      deletedBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
    },
    // paranoid stays off: a deleted comment is a visible placeholder, not a hidden row.
    { sequelize, modelName: "comment", tableName: "comments", underscored: true, updatedAt: false },
  );
  return M;
}
