import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Role } from "@/lib/access/roles";

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare email: string;
  declare role: Role;
  /** SHA-256 of the token in the e-mailed link; the token itself is never stored. */
  declare tokenHash: string;
  declare invitedBy: string | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initInvitation(sequelize: Sequelize) {
  const M = class extends Invitation {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      email: { type: DataTypes.STRING, allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      invitedBy: { type: DataTypes.UUID },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE },
      revokedAt: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "invitation", tableName: "invitations", underscored: true },
  );
  return M;
}
