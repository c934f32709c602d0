import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { UnitSystem } from "@ringdown/contracts";

export class UserModel extends Model<InferAttributes<UserModel>, InferCreationAttributes<UserModel>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare passwordHash: string;
  declare name: string;
  declare unitSystem: CreationOptional<UnitSystem>;
  declare activeShopId: CreationOptional<string | null>;
  /** Bumped to end every session of the user at once (tokens carry the version they were issued with). */
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUserModel(sequelize: Sequelize): void {
  UserModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      passwordHash: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      unitSystem: { type: DataTypes.TEXT, allowNull: false, defaultValue: "metric" },
      activeShopId: { type: DataTypes.UUID, allowNull: true },
      sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "users", underscored: true },
  );
}
