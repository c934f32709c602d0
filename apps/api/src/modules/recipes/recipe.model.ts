import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Operation, RecipeParams, RecipeResultSummary, RecipeStatus } from "@ringdown/contracts";

/** A recipe's current state; every change also writes a RecipeRevisionModel row. */
export class RecipeModel extends Model<InferAttributes<RecipeModel>, InferCreationAttributes<RecipeModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare name: string;
  declare assemblyId: string;
  declare machineId: string;
  declare cutterId: string;
  declare materialId: string;
  declare operation: Operation;
  declare status: CreationOptional<RecipeStatus>;
  declare revision: CreationOptional<number>;
  declare params: RecipeParams;
  declare result: RecipeResultSummary;
  declare rpm: number;
  declare feedMmPerMin: number;
  declare notes: CreationOptional<string>;
  declare needsRecheck: CreationOptional<boolean>;
  declare authorId: string;
  declare lastComment: CreationOptional<string | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One saved state of a recipe (who changed what, when). */
export class RecipeRevisionModel extends Model<InferAttributes<RecipeRevisionModel>, InferCreationAttributes<RecipeRevisionModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare recipeId: string;
  declare revision: number;
  declare name: string;
  declare assemblyId: string;
  declare materialId: string;
  declare operation: Operation;
  declare params: RecipeParams;
  declare result: RecipeResultSummary;
  declare notes: string;
  declare changeNote: string;
  declare authorId: string;
  declare createdAt: CreationOptional<Date>;
}

/** One status change of a recipe. */
export class RecipeTransitionModel extends Model<InferAttributes<RecipeTransitionModel>, InferCreationAttributes<RecipeTransitionModel>> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare recipeId: string;
  declare fromStatus: RecipeStatus;
  declare toStatus: RecipeStatus;
  declare comment: string;
  declare actorId: string;
  declare createdAt: CreationOptional<Date>;
}

export function initRecipeModels(sequelize: Sequelize): void {
  RecipeModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      assemblyId: { type: DataTypes.UUID, allowNull: false },
      machineId: { type: DataTypes.UUID, allowNull: false },
      cutterId: { type: DataTypes.UUID, allowNull: false },
      materialId: { type: DataTypes.UUID, allowNull: false },
      operation: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: "draft" },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      params: { type: DataTypes.JSONB, allowNull: false },
      result: { type: DataTypes.JSONB, allowNull: false },
      rpm: { type: DataTypes.DOUBLE, allowNull: false },
      feedMmPerMin: { type: DataTypes.DOUBLE, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      needsRecheck: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      authorId: { type: DataTypes.UUID, allowNull: false },
      lastComment: { type: DataTypes.TEXT, allowNull: true },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "recipes", underscored: true },
  );
  RecipeRevisionModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      recipeId: { type: DataTypes.UUID, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      assemblyId: { type: DataTypes.UUID, allowNull: false },
      materialId: { type: DataTypes.UUID, allowNull: false },
      operation: { type: DataTypes.TEXT, allowNull: false },
      params: { type: DataTypes.JSONB, allowNull: false },
      result: { type: DataTypes.JSONB, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false },
      changeNote: { type: DataTypes.STRING(500), allowNull: false },
      authorId: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "recipe_revisions", underscored: true, updatedAt: false },
  );
  RecipeTransitionModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      recipeId: { type: DataTypes.UUID, allowNull: false },
      fromStatus: { type: DataTypes.TEXT, allowNull: false },
      toStatus: { type: DataTypes.TEXT, allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: false },
      actorId: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "recipe_transitions", underscored: true, updatedAt: false },
  );
}
