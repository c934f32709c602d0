import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import type { MachineBody, MachineKind } from "@ringdown/contracts";
import { MachineModeModel } from "./machine-mode.model.js";

/** A machine of the shop. Spindle and axes are JSON documents; modes live in machine_modes. */
export class MachineModel extends Model<InferAttributes<MachineModel>, InferCreationAttributes<MachineModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare name: string;
  declare kind: MachineKind;
  declare spindle: MachineBody["spindle"];
  declare axes: MachineBody["axes"];
  declare deflectionCeilingMm: number;
  declare avoidBands: MachineBody["avoidBands"];
  declare modeMarginPct: number;
  declare estimatedFields: string[];
  declare notes: string;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare modes?: NonAttribute<MachineModeModel[]>;
}

export function initMachineModel(sequelize: Sequelize): void {
  MachineModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      spindle: { type: DataTypes.JSONB, allowNull: false },
      axes: { type: DataTypes.JSONB, allowNull: false },
      deflectionCeilingMm: { type: DataTypes.DOUBLE, allowNull: false, field: "deflection_ceiling_mm" },
      avoidBands: { type: DataTypes.JSONB, allowNull: false },
      modeMarginPct: { type: DataTypes.DOUBLE, allowNull: false, field: "mode_margin_pct" },
      estimatedFields: { type: DataTypes.JSONB, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "machines", underscored: true },
  );
}

/** Call after both models are initialised. */
export function associateMachineModels(): void {
  MachineModel.hasMany(MachineModeModel, { as: "modes", foreignKey: "machineId" });
}
