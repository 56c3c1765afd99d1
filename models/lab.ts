import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class Lab extends Model<InferAttributes<Lab>, InferCreationAttributes<Lab>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLab(sequelize: Sequelize) {
  const M = class extends Lab {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "lab", tableName: "labs", underscored: true },
  );
  return M;
}
