import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Axis, RecordingFormat, RecordingKind, RecordingResults, RecordingStatus } from "@ringdown/contracts";

/** An uploaded recording (cut, tap test, spindle running free, frequency response) and its analysis state. */
export class RecordingModel extends Model<InferAttributes<RecordingModel>, InferCreationAttributes<RecordingModel>> {
  declare id: string;
  declare shopId: string;
  declare machineId: string;
  declare kind: RecordingKind;
  declare format: RecordingFormat;
  declare storageKey: string;
  declare originalName: string;
  declare sizeBytes: number;
  declare sampleRateHz: number | null;
  declare durationS: number | null;
  declare channels: number | null;
  declare rpm: number | null;
  declare flutes: number | null;
  declare direction: Axis | null;
  declare dialSetting: string | null;
  declare note: string;
  declare status: CreationOptional<RecordingStatus>;
  declare progress: CreationOptional<number>;
  declare failureReason: CreationOptional<string | null>;
  declare attempts: CreationOptional<number>;
  declare results: CreationOptional<RecordingResults | null>;
  declare acceptedModeId: CreationOptional<string | null>;
  declare dialRpmApplied: CreationOptional<boolean>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare startedAt: CreationOptional<Date | null>;
  declare analysedAt: CreationOptional<Date | null>;
}

export function initRecordingModel(sequelize: Sequelize): void {
  RecordingModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      shopId: { type: DataTypes.UUID, allowNull: false },
      machineId: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      format: { type: DataTypes.TEXT, allowNull: false },
      storageKey: { type: DataTypes.TEXT, allowNull: false },
      originalName: { type: DataTypes.STRING(255), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      sampleRateHz: { type: DataTypes.DOUBLE, allowNull: true, field: "sample_rate_hz" },
      durationS: { type: DataTypes.DOUBLE, allowNull: true, field: "duration_s" },
      channels: { type: DataTypes.INTEGER, allowNull: true },
      rpm: { type: DataTypes.DOUBLE, allowNull: true },
      flutes: { type: DataTypes.INTEGER, allowNull: true },
      direction: { type: DataTypes.TEXT, allowNull: true },
      dialSetting: { type: DataTypes.STRING(20), allowNull: true },
      note: { type: DataTypes.STRING(500), allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: "queued" },
      progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      failureReason: { type: DataTypes.TEXT, allowNull: true },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      results: { type: DataTypes.JSONB, allowNull: true },
      acceptedModeId: { type: DataTypes.UUID, allowNull: true },
      dialRpmApplied: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
      startedAt: { type: DataTypes.DATE, allowNull: true },
      analysedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: "recordings", underscored: true },
  );
}
