import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Axis } from "@ringdown/contracts";

/** A dial-indicator reversal test on one axis. */
export class BacklashReadingModel extends Model<InferAttributes<BacklashReadingModel>, InferCreationAttributes<BacklashReadingModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare machineId: string;
  declare axis: Axis;
  declare backlashMm: number;
  declare note: string;
  declare measuredAt: Date;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initBacklashReadingModel(sequelize: Sequelize): void {
  BacklashReadingModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      machineId: { type: DataTypes.UUID, allowNull: false },
      axis: { type: DataTypes.TEXT, allowNull: false },
      backlashMm: { type: DataTypes.DOUBLE, allowNull: false, field: "backlash_mm" },
      note: { type: DataTypes.STRING(500), allowNull: false },
      measuredAt: { type: DataTypes.DATE, allowNull: false },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "backlash_readings", underscored: true },
  );
}
