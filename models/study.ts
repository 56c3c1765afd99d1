import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class Study extends Model<InferAttributes<Study>, InferCreationAttributes<Study>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare name: string;
  declare tissue: string;
  declare organism: string;
  declare description: string | null;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initStudy(sequelize: Sequelize) {
  const M = class extends Study {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      tissue: { type: DataTypes.STRING(120), allowNull: false },
      organism: { type: DataTypes.STRING(120), allowNull: false },
      description: { type: DataTypes.TEXT },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "study", tableName: "studies", underscored: true },
  );
  return M;
}
