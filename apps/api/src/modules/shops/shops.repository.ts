import type { Role } from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import { MembershipModel } from "./membership.model.js";
import { ShopModel } from "./shop.model.js";

export interface ShopRecord {
  id: string;
  name: string;
  createdAt: Date;
}

export interface MembershipRecord {
  shopId: string;
  shopName: string;
  shopCreatedAt: Date;
  userId: string;
  role: Role;
}

const toShop = (row: ShopModel): ShopRecord => ({ id: row.id, name: row.name, createdAt: row.createdAt });

function toMembership(row: MembershipModel): MembershipRecord {
  if (!row.shop) throw new Error("membership loaded without its shop");
  return {
    shopId: row.shopId,
    shopName: row.shop.name,
    shopCreatedAt: row.shop.createdAt,
    userId: row.userId,
    role: row.role,
  };
}

/** Creates a shop and makes `userId` its owner, in the caller's transaction. */
export async function createShopWithOwner(
  input: { id?: string; name: string; ownerId: string },
  tx: Tx,
): Promise<ShopRecord> {
  const shop = await ShopModel.create(input.id ? { id: input.id, name: input.name } : { name: input.name }, {
    transaction: tx,
  });
  await MembershipModel.create({ shopId: shop.id, userId: input.ownerId, role: "owner" }, { transaction: tx });
  return toShop(shop);
}

/** The user's membership of one shop, or null when they are not a member (or it does not exist). */
export async function findMembership(shopId: string, userId: string, tx?: Tx): Promise<MembershipRecord | null> {
  const row = await MembershipModel.findOne({
    where: { shopId, userId },
    include: [{ model: ShopModel, as: "shop", attributes: ["id", "name", "createdAt"] }],
    transaction: tx ?? null,
  });
  return row ? toMembership(row) : null;
}

export async function listMembershipsOfUser(userId: string): Promise<MembershipRecord[]> {
  const rows = await MembershipModel.findAll({
    where: { userId },
    include: [{ model: ShopModel, as: "shop", attributes: ["id", "name", "createdAt"] }],
    order: [
      [{ model: ShopModel, as: "shop" }, "name", "ASC"],
      ["shopId", "ASC"],
    ],
  });
  return rows.map(toMembership);
}

/** Renames the shop `shopId` (scoped by id: the caller's shop only). */
/** The shop's name, its row locked (NO KEY UPDATE, as `lockShop`) until `tx` ends; null when there is no such shop. */
export async function lockShopName(shopId: string, tx: Tx): Promise<string | null> {
  const row = await ShopModel.findByPk(shopId, { attributes: ["name"], transaction: tx, lock: tx.LOCK.NO_KEY_UPDATE });
  return row?.name ?? null;
}

export async function renameShop(shopId: string, name: string, tx?: Tx): Promise<ShopRecord | null> {
  const [count, rows] = await ShopModel.update({ name }, { where: { id: shopId }, returning: true, transaction: tx ?? null });
  const row = rows[0];
  return count > 0 && row ? toShop(row) : null;
}

export async function addMember(input: { shopId: string; userId: string; role: Role }, tx?: Tx): Promise<void> {
  await MembershipModel.create(input, { transaction: tx ?? null });
}
