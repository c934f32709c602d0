import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { LadderParameter, LadderRung } from "@ringdown/contracts";

/** A test-cut ladder: rungs stepping one parameter through the recipe's safe window. */
export class LadderModel extends Model<InferAttributes<LadderModel>, InferCreationAttributes<LadderModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare recipeId: string;
  declare parameter: LadderParameter;
  declare rungs: LadderRung[];
  declare chosenRung: number | null;
  /** Recipe revision the ladder was built from. */
  declare baseRevision: number;
  /** The stepped parameter's window { min, max, unit }. */
  declare stepWindow: { min: number; max: number; unit: string };
  declare note: string;
  declare createdBy: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLadderModel(sequelize: Sequelize): void {
  LadderModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      recipeId: { type: DataTypes.UUID, allowNull: false },
      parameter: { type: DataTypes.TEXT, allowNull: false },
      rungs: { type: DataTypes.JSONB, allowNull: false },
      chosenRung: { type: DataTypes.INTEGER, allowNull: true },
      baseRevision: { type: DataTypes.INTEGER, allowNull: false },
      stepWindow: { type: DataTypes.JSONB, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      createdBy: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "test_cut_ladders", underscored: true },
  );
}
