import type { ImageLayout } from "@/lib/imaging/read-image-layout";
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export type UploadKind = "image" | "table";
/** `receiving`: the row exists, the original may not yet; hidden everywhere but the sweep. */
export type UploadState = "receiving" | "stored";

export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: string;
  declare labId: string;
  declare specimenId: string;
  declare filename: string;
  declare kind: UploadKind;
  /** Judged from the file's content, not its name. */
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare storageKey: string;
  declare state: CreationOptional<UploadState>;
  declare pixelSizeUm: number | null;
  /** Where the pixel size came from: `uploader` (typed in) or the file's metadata (`tiff-resolution`, `ome-xml`, `png-phys`, `jfif-density`). */
  declare pixelSizeSource: string | null;
  /** The batch it was uploaded with, if any. */
  declare batchId: CreationOptional<string | null>;
  /** Images: size, bit depth, channels, planes, time points from the file's headers; null for tables and older uploads. */
  declare imageLayout: CreationOptional<ImageLayout | null>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initUpload(sequelize: Sequelize) {
  const M = class extends Upload {};
  M.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      labId: { type: DataTypes.UUID, allowNull: false },
      specimenId: { type: DataTypes.UUID, allowNull: false },
      filename: { type: DataTypes.STRING(255), allowNull: false },
      kind: { type: DataTypes.STRING(10), allowNull: false },
      contentType: { type: DataTypes.STRING(100), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      storageKey: { type: DataTypes.STRING(300), allowNull: false, unique: true },
      state: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "stored" },
      pixelSizeUm: { type: DataTypes.FLOAT },
      pixelSizeSource: { type: DataTypes.STRING(20) },
      batchId: { type: DataTypes.UUID },
      imageLayout: { type: DataTypes.JSON },
      createdBy: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
    },
    {
      sequelize,
      modelName: "upload",
      tableName: "uploads",
      underscored: true,
      updatedAt: false,
      // Every query sees stored uploads only; the upload path and the sweep use `unscoped()`.
      defaultScope: { where: { state: "stored" } },
    },
  );
  return M;
}
