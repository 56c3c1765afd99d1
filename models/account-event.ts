import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/**
 * An audit event of an account rather than a lab: sign-in success, failure and lockout, API token
 * creation, revocation and expiry. Shown to the account itself (Account page, "Recent sign-ins
 * and API tokens") and to the managers of the labs it belongs to (the lab's audit page).
 */
export class AccountEvent extends Model<InferAttributes<AccountEvent>, InferCreationAttributes<AccountEvent>> {
  declare id: CreationOptional<string>;
  /** Null for a failed sign-in with an address that has no account. */
  declare userId: string | null;
  /** The address used (kept as typed for an unknown address). */
  declare email: string | null;
  /** Dotted verb: `signin.succeeded`, `signin.failed`, `signin.locked`, `token.created`, `token.revoked`, `token.expired`. */
  declare action: string;
  declare summary: string;
  declare details: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;
}

export function initAccountEvent(sequelize: Sequelize) {
  const M = class extends AccountEvent {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      userId: { type: DataTypes.UUID },
      email: { type: DataTypes.STRING },
      action: { type: DataTypes.STRING(60), allowNull: false },
      summary: { type: DataTypes.STRING(500), allowNull: false },
      details: { type: DataTypes.JSON },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "accountEvent", tableName: "account_events", underscored: true, updatedAt: false },
  );
  return M;
}
