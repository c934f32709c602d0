import type { Role, Shop } from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { updateUser } from "../users/users.repository.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { createShopWithOwner, lockShopName, renameShop, type ShopRecord } from "./shops.repository.js";

const toShop = (shop: ShopRecord, role: Role): Shop => ({
  id: shop.id,
  name: shop.name,
  role,
  createdAt: shop.createdAt.toISOString(),
});

/** A new shop owned by `userId`, which becomes their active shop. */
export async function createShop(actor: AuditActor & { userId: string }, name: string): Promise<Shop> {
  const userId = actor.userId;
  const shop = await inTransaction(async (tx) => {
    const created = await createShopWithOwner({ name, ownerId: userId }, tx);
    await updateUser(userId, { activeShopId: created.id }, tx);
    await recordAuditEvent(tx, {
      shopId: created.id,
      actor: actor,
      action: "shop.created",
      subject: { type: "shop", id: created.id, label: created.name },
    });
    return created;
  });
  return toShop(shop, "owner");
}

/** The shop as its member `role` sees it. */
export function describeShop(shop: ShopRecord, role: Role): Shop {
  return toShop(shop, role);
}

export async function renameOwnShop(shopId: string, name: string, role: Role, actor: AuditActor): Promise<Shop> {
  const shop = await inTransaction(async (tx) => {
    const before = await lockShopName(shopId, tx);
    const renamed = await renameShop(shopId, name, tx);
    if (!renamed || before === null) throw AppError.notFound("Shop not found.");
    if (before !== renamed.name) {
      await recordAuditEvent(tx, {
        shopId,
        actor,
        action: "shop.renamed",
        subject: { type: "shop", id: shopId, label: renamed.name },
        detail: { from: before, to: renamed.name },
      });
    }
    return renamed;
  });
  return toShop(shop, role);
}
