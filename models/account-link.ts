import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export type AccountLinkKind = "password-reset" | "email-change";

/** A one-time e-mailed link of an account: a password reset, or the confirmation of a new address. */
export class AccountLink extends Model<InferAttributes<AccountLink>, InferCreationAttributes<AccountLink>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare kind: AccountLinkKind;
  /** SHA-256 of the token in the e-mailed link; the token itself is never stored. */
  declare tokenHash: string;
  /** E-mail change: the address the account moves to once the link is opened. */
  declare newEmail: string | null;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initAccountLink(sequelize: Sequelize) {
  const M = class extends AccountLink {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.STRING(30), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      newEmail: { type: DataTypes.STRING },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE },
      createdAt: { type: DataTypes.DATE, defaultValue: DataTypes.NOW },
    },
    { sequelize, modelName: "accountLink", tableName: "account_links", underscored: true, timestamps: false },
  );
  return M;
}
