import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { CutOutcome } from "@ringdown/contracts";

/** How one cut of a recipe went, as someone on the floor recorded it. */
export class CutLogModel extends Model<InferAttributes<CutLogModel>, InferCreationAttributes<CutLogModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare recipeId: string;
  declare recipeRevision: number;
  declare machineId: string;
  declare materialId: string;
  declare userId: string;
  declare outcome: CutOutcome;
  declare actualRpm: number;
  declare actualFeedMmPerMin: number;
  declare axialDepthMm: number;
  declare radialDepthMm: number;
  declare feedOverridePct: number | null;
  declare note: string;
  declare createdAt: CreationOptional<Date>;
}

/** A photo attached to a cut log; the bytes live in the storage under `storageKey`. */
export class CutLogPhotoModel extends Model<InferAttributes<CutLogPhotoModel>, InferCreationAttributes<CutLogPhotoModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare cutLogId: string;
  declare storageKey: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare createdAt: CreationOptional<Date>;
}

export function initCutLogModels(sequelize: Sequelize): void {
  CutLogModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      recipeId: { type: DataTypes.UUID, allowNull: false },
      recipeRevision: { type: DataTypes.INTEGER, allowNull: false },
      machineId: { type: DataTypes.UUID, allowNull: false },
      materialId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      outcome: { type: DataTypes.TEXT, allowNull: false },
      actualRpm: { type: DataTypes.DOUBLE, allowNull: false },
      actualFeedMmPerMin: { type: DataTypes.DOUBLE, allowNull: false },
      axialDepthMm: { type: DataTypes.DOUBLE, allowNull: false },
      radialDepthMm: { type: DataTypes.DOUBLE, allowNull: false },
      feedOverridePct: { type: DataTypes.DOUBLE, allowNull: true },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "cut_logs", underscored: true, updatedAt: false },
  );
  CutLogPhotoModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      cutLogId: { type: DataTypes.UUID, allowNull: false },
      storageKey: { type: DataTypes.TEXT, allowNull: false },
      contentType: { type: DataTypes.TEXT, allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "cut_log_photos", underscored: true, updatedAt: false },
  );
}
