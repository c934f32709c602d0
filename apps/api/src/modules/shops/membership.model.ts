import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import type { Role } from "@ringdown/contracts";
import { ShopModel } from "./shop.model.js";
import { UserModel } from "../users/user.model.js";

/** A person's place in one shop; the role is per membership. */
export class MembershipModel extends Model<
  InferAttributes<MembershipModel>,
  InferCreationAttributes<MembershipModel>
> {
  declare id: CreationOptional<string>;
  declare shopId: string;
  declare userId: string;
  declare role: Role;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare shop?: NonAttribute<ShopModel>;
  declare user?: NonAttribute<UserModel>;
}

export function initMembershipModel(sequelize: Sequelize): void {
  MembershipModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      shopId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      role: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "memberships", underscored: true },
  );
  MembershipModel.belongsTo(ShopModel, { as: "shop", foreignKey: "shopId" });
  MembershipModel.belongsTo(UserModel, { as: "user", foreignKey: "userId" });
}
