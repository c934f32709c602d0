import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Axis, MachineMode } from "@ringdown/contracts";

/** One vibration mode of a machine at the tool, in one direction. */
export class MachineModeModel extends Model<
  InferAttributes<MachineModeModel>,
  InferCreationAttributes<MachineModeModel>
> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare machineId: string;
  declare direction: Axis;
  declare frequencyHz: number;
  declare dampingRatio: number;
  declare stiffnessNPerMm: number;
  declare source: MachineMode["source"];
  declare note: string;
  declare measuredAt: CreationOptional<Date>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMachineModeModel(sequelize: Sequelize): void {
  MachineModeModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      machineId: { type: DataTypes.UUID, allowNull: false },
      direction: { type: DataTypes.TEXT, allowNull: false },
      frequencyHz: { type: DataTypes.DOUBLE, allowNull: false, field: "frequency_hz" },
      dampingRatio: { type: DataTypes.DOUBLE, allowNull: false, field: "damping_ratio" },
      stiffnessNPerMm: { type: DataTypes.DOUBLE, allowNull: false, field: "stiffness_n_per_mm" },
      source: { type: DataTypes.TEXT, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: false },
      measuredAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "machine_modes", underscored: true },
  );
}
