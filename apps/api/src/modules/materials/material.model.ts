import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { MaterialBody, MaterialGroup } from "@ringdown/contracts";

/** A workpiece material: global (shop_id NULL, keyed by global_key, read-only) or a shop's own. */
export class MaterialModel extends Model<InferAttributes<MaterialModel>, InferCreationAttributes<MaterialModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string | null;
  declare globalKey: CreationOptional<string | null>;
  declare copiedFromId: CreationOptional<string | null>;
  declare name: string;
  declare materialGroup: MaterialGroup;
  declare hardness: string;
  declare cuttingSpeed: MaterialBody["cuttingSpeed"];
  declare chipLoad: MaterialBody["chipLoad"];
  declare kc11NPerMm2: number | null;
  declare mc: number | null;
  declare unitPowerJPerMm3: number | null;
  declare minChipThicknessMm: number;
  declare sourceNote: string;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMaterialModel(sequelize: Sequelize): void {
  MaterialModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: true },
      globalKey: { type: DataTypes.TEXT, allowNull: true },
      copiedFromId: { type: DataTypes.UUID, allowNull: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      materialGroup: { type: DataTypes.TEXT, allowNull: false },
      hardness: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "" },
      cuttingSpeed: { type: DataTypes.JSONB, allowNull: false },
      chipLoad: { type: DataTypes.JSONB, allowNull: false },
      kc11NPerMm2: { type: DataTypes.DOUBLE, allowNull: true, field: "kc11_n_per_mm2" },
      mc: { type: DataTypes.DOUBLE, allowNull: true },
      unitPowerJPerMm3: { type: DataTypes.DOUBLE, allowNull: true, field: "unit_power_j_per_mm3" },
      minChipThicknessMm: { type: DataTypes.DOUBLE, allowNull: false, field: "min_chip_thickness_mm" },
      sourceNote: { type: DataTypes.TEXT, allowNull: false },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "materials", underscored: true },
  );
}
