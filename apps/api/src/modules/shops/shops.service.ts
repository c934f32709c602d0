import type { Role, Shop } from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { updateUser } from "../users/users.repository.js";
import { createShopWithOwner, renameShop, type ShopRecord } from "./shops.repository.js";

const toShop = (shop: ShopRecord, role: Role): Shop => ({
  id: shop.id,
  name: shop.name,
  role,
  createdAt: shop.createdAt.toISOString(),
});

/** A new shop owned by `userId`, which becomes their active shop. */
export async function createShop(userId: string, name: string): Promise<Shop> {
  const shop = await inTransaction(async (tx) => {
    const created = await createShopWithOwner({ name, ownerId: userId }, tx);
    await updateUser(userId, { activeShopId: created.id }, tx);
    return created;
  });
  return toShop(shop, "owner");
}

/** The shop as its member `role` sees it. */
export function describeShop(shop: ShopRecord, role: Role): Shop {
  return toShop(shop, role);
}

export async function renameOwnShop(shopId: string, name: string, role: Role): Promise<Shop> {
  const shop = await renameShop(shopId, name);
  if (!shop) throw AppError.notFound("Shop not found.");
  return toShop(shop, role);
}
