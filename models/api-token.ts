import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare name: string;
  /** SHA-256 of the secret; the secret is shown once and never stored. */
  declare tokenHash: string;
  /** First characters of the secret, so a user can tell tokens apart. */
  declare prefix: string;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  /** After this instant the token answers 401; null = never expires. */
  declare expiresAt: CreationOptional<Date | null>;
  /** When the expiry was written to the audit trail (once per token). */
  declare expiryRecordedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initApiToken(sequelize: Sequelize) {
  const M = class extends ApiToken {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      prefix: { type: DataTypes.STRING(16), allowNull: false },
      lastUsedAt: { type: DataTypes.DATE },
      revokedAt: { type: DataTypes.DATE },
      expiresAt: { type: DataTypes.DATE },
      expiryRecordedAt: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "apiToken", tableName: "api_tokens", underscored: true, updatedAt: false },
  );
  return M;
}
