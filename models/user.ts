import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare name: string | null;
  declare email: string;
  declare emailVerified: Date | null;
  declare image: CreationOptional<string | null>;
  declare passwordHash: string | null;
  declare notifyByEmail: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
}

export function initUser(sequelize: Sequelize) {
  const M = class extends User {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      name: { type: DataTypes.STRING },
      email: { type: DataTypes.STRING, allowNull: false, unique: "email" },
      emailVerified: { type: DataTypes.DATE },
      image: { type: DataTypes.STRING },
      passwordHash: { type: DataTypes.STRING },
      notifyByEmail: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: { type: DataTypes.DATE, defaultValue: DataTypes.NOW },
    },
    { sequelize, modelName: "user", tableName: "users", underscored: true, timestamps: false },
  );
  return M;
}
