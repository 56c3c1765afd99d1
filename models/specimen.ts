import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class Specimen extends Model<InferAttributes<Specimen>, InferCreationAttributes<Specimen>> {
  declare id: CreationOptional<string>;
  declare labId: string;
  declare studyId: string;
  declare label: string;
  /** e.g. `control`, `inhibitor X 10 µM`, a genotype name. */
  declare condition: string;
  declare stage: string | null;
  declare genotype: string | null;
  declare notes: string | null;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSpecimen(sequelize: Sequelize) {
  const M = class extends Specimen {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      studyId: { type: DataTypes.UUID, allowNull: false },
      label: { type: DataTypes.STRING(120), allowNull: false },
      condition: { type: DataTypes.STRING(120), allowNull: false },
      stage: { type: DataTypes.STRING(60) },
      genotype: { type: DataTypes.STRING(120) },
      notes: { type: DataTypes.TEXT },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: "specimen", tableName: "specimens", underscored: true },
  );
  return M;
}
