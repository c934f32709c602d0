import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { CutterShape, CutterStatus, ToolMaterial } from "@ringdown/contracts";

/** A cutter in the shop's list; soft-deleted with `deletedAt`. */
export class CutterModel extends Model<InferAttributes<CutterModel>, InferCreationAttributes<CutterModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare name: string;
  declare shape: CutterShape;
  declare diameterMm: number;
  declare flutes: number;
  declare fluteLengthMm: number;
  declare overallLengthMm: number;
  declare shankDiameterMm: number;
  declare helixDeg: number;
  declare cornerRadiusMm: number;
  declare tipAngleDeg: number | null;
  declare toolMaterial: ToolMaterial;
  declare coating: string;
  declare maker: string;
  declare partNumber: string;
  declare maxRpm: number | null;
  declare notes: string;
  declare status: CreationOptional<CutterStatus>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCutterModel(sequelize: Sequelize): void {
  CutterModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      shape: { type: DataTypes.TEXT, allowNull: false },
      diameterMm: { type: DataTypes.DOUBLE, allowNull: false, field: "diameter_mm" },
      flutes: { type: DataTypes.INTEGER, allowNull: false },
      fluteLengthMm: { type: DataTypes.DOUBLE, allowNull: false, field: "flute_length_mm" },
      overallLengthMm: { type: DataTypes.DOUBLE, allowNull: false, field: "overall_length_mm" },
      shankDiameterMm: { type: DataTypes.DOUBLE, allowNull: false, field: "shank_diameter_mm" },
      helixDeg: { type: DataTypes.DOUBLE, allowNull: false, field: "helix_deg" },
      cornerRadiusMm: { type: DataTypes.DOUBLE, allowNull: false, field: "corner_radius_mm" },
      tipAngleDeg: { type: DataTypes.DOUBLE, allowNull: true, field: "tip_angle_deg" },
      toolMaterial: { type: DataTypes.TEXT, allowNull: false },
      coating: { type: DataTypes.STRING(60), allowNull: false },
      maker: { type: DataTypes.STRING(120), allowNull: false },
      partNumber: { type: DataTypes.STRING(120), allowNull: false },
      maxRpm: { type: DataTypes.DOUBLE, allowNull: true, field: "max_rpm" },
      notes: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: "proposed" },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "cutters", underscored: true },
  );
}
