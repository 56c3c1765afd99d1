import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/**
 * A discussion about one object of a lab (`targetType` + `targetId`, e.g. a readout). Open until
 * someone resolves it; `lastActivityAt` moves with every comment so lists show live threads first.
 */
export class CommentThread extends Model<InferAttributes<CommentThread>, InferCreationAttributes<CommentThread>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare targetType: string;
  declare targetId: string;
  declare status: CreationOptional<"open" | "resolved">;
  declare createdBy: string | null;
  declare resolvedBy: CreationOptional<string | null>;
  declare resolvedAt: CreationOptional<Date | null>;
  declare lastActivityAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCommentThread(sequelize: Sequelize) {
  const M = class extends CommentThread {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      targetType: { type: DataTypes.STRING(20), allowNull: false },
      targetId: { type: DataTypes.UUID, allowNull: false },
      status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "open" },
      createdBy: { type: DataTypes.UUID },
      resolvedBy: { type: DataTypes.UUID },
      resolvedAt: { type: DataTypes.DATE },
      lastActivityAt: { type: DataTypes.DATE, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "commentThread", tableName: "comment_threads", underscored: true },
  );
  return M;
}
