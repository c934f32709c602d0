import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { CutterModel } from "../cutters/cutter.model.js";
import { MachineModel } from "../machines/machine.model.js";

/** A cutter in a holder or collet on one machine, at a stick-out, with its measured runout. */
export class AssemblyModel extends Model<InferAttributes<AssemblyModel>, InferCreationAttributes<AssemblyModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare machineId: string;
  declare cutterId: string;
  declare holder: string;
  declare stickoutMm: number;
  declare runoutMm: number;
  declare notes: string;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare machine?: NonAttribute<MachineModel>;
  declare cutter?: NonAttribute<CutterModel>;
}

export function initAssemblyModel(sequelize: Sequelize): void {
  AssemblyModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      machineId: { type: DataTypes.UUID, allowNull: false },
      cutterId: { type: DataTypes.UUID, allowNull: false },
      holder: { type: DataTypes.STRING(120), allowNull: false },
      stickoutMm: { type: DataTypes.DOUBLE, allowNull: false, field: "stickout_mm" },
      runoutMm: { type: DataTypes.DOUBLE, allowNull: false, field: "runout_mm" },
      notes: { type: DataTypes.TEXT, allowNull: false },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "assemblies", underscored: true },
  );
  AssemblyModel.belongsTo(MachineModel, { as: "machine", foreignKey: "machineId" });
  AssemblyModel.belongsTo(CutterModel, { as: "cutter", foreignKey: "cutterId" });
}
