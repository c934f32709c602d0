import {
  DataTypes,
  Model,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A signed-out session token, refused until it would have expired anyway. */
export class RevokedSessionModel extends Model<
  InferAttributes<RevokedSessionModel>,
  InferCreationAttributes<RevokedSessionModel>
> {
  declare tokenId: string;
  declare expiresAt: Date;
}

export function initRevokedSessionModel(sequelize: Sequelize): void {
  RevokedSessionModel.init(
    {
      tokenId: { type: DataTypes.UUID, primaryKey: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, tableName: "revoked_sessions", underscored: true, timestamps: false },
  );
}
