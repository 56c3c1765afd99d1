import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare actorId: string | null;
  declare actorEmail: string | null;
  /** Dotted verb, e.g. `member.role_changed`, `upload.deleted`. */
  declare action: string;
  declare targetType: string;
  declare targetId: string | null;
  /** One human sentence, kept even if the target is deleted later. */
  declare summary: string;
  declare details: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditEvent(sequelize: Sequelize) {
  const M = class extends AuditEvent {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      actorId: { type: DataTypes.UUID },
      actorEmail: { type: DataTypes.STRING },
      action: { type: DataTypes.STRING(60), allowNull: false },
      targetType: { type: DataTypes.STRING(40), allowNull: false },
      targetId: { type: DataTypes.STRING(64) },
      summary: { type: DataTypes.STRING(500), allowNull: false },
      details: { type: DataTypes.JSON },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "auditEvent", tableName: "audit_events", underscored: true, updatedAt: false },
  );
  return M;
}
