import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { KineticsDefinition } from "@/lib/kinetics/definition-schema";

/** One immutable version of a lab kinetics' definition (`KineticsDefinitionSchema`). */
export class KineticsVersion extends Model<InferAttributes<KineticsVersion>, InferCreationAttributes<KineticsVersion>> {
  declare id: CreationOptional<string>;
  declare kineticsId: string;
  declare labId: string;
  declare version: number;
  declare definition: KineticsDefinition;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initKineticsVersion(sequelize: Sequelize) {
  const M = class extends KineticsVersion {};
  M.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      kineticsId: { type: DataTypes.UUID, allowNull: false },
      labId: { type: DataTypes.UUID, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      definition: { type: DataTypes.JSON, allowNull: false },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: "kineticsVersion", tableName: "kinetics_versions", underscored: true, updatedAt: false },
  );
  return M;
}
