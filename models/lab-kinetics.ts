import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A lab's own kinetics; its definitions live in KineticsVersion rows (never edited in place). */
export class LabKinetics extends Model<InferAttributes<LabKinetics>, InferCreationAttributes<LabKinetics>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare name: string;
  declare description: string | null;
  declare latestVersion: CreationOptional<number>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLabKinetics(sequelize: Sequelize) {
  const M = class extends LabKinetics {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      description: { type: DataTypes.TEXT },
      latestVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "labKinetics", tableName: "lab_kinetics", underscored: true },
  );
  return M;
}
