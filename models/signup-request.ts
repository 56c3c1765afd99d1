import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A sign-up waiting for its e-mailed confirmation link; the account is created when it is opened. */
export class SignupRequest extends Model<InferAttributes<SignupRequest>, InferCreationAttributes<SignupRequest>> {
  declare id: CreationOptional<string>;
  /** SHA-256 of the token in the e-mailed link; the token itself is never stored. */
  declare tokenHash: string;
  declare email: string;
  declare name: string;
  declare labName: string;
  declare passwordHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initSignupRequest(sequelize: Sequelize) {
  const M = class extends SignupRequest {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      email: { type: DataTypes.STRING, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      labName: { type: DataTypes.STRING(120), allowNull: false },
      passwordHash: { type: DataTypes.STRING, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE },
      createdAt: { type: DataTypes.DATE, defaultValue: DataTypes.NOW },
    },
    { sequelize, modelName: "signupRequest", tableName: "signup_requests", underscored: true, timestamps: false },
  );
  return M;
}
