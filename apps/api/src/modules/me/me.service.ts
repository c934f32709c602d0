import type { Me, UpdateMeBody } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { findMembership, listMembershipsOfUser } from "../shops/shops.repository.js";
import { findUserById, updateUser } from "../users/users.repository.js";

/**
 * The signed-in person, their shops and the active one. A stored active shop the user no longer
 * belongs to falls back to their first shop (alphabetically), or null when they have none.
 */
export async function getMe(userId: string): Promise<Me> {
  const [user, memberships] = await Promise.all([findUserById(userId), listMembershipsOfUser(userId)]);
  if (!user) throw AppError.unauthenticated("Your account no longer exists.");
  const stillMember = memberships.some((m) => m.shopId === user.activeShopId);
  return {
    user: { id: user.id, email: user.email, name: user.name, unitSystem: user.unitSystem },
    memberships: memberships.map((m) => ({ shopId: m.shopId, shopName: m.shopName, role: m.role })),
    activeShopId: stillMember ? user.activeShopId : (memberships[0]?.shopId ?? null),
  };
}

export async function updateMe(userId: string, patch: UpdateMeBody): Promise<Me> {
  if (patch.activeShopId !== undefined && !(await findMembership(patch.activeShopId, userId))) {
    // Same answer whether the shop does not exist or is someone else's.
    throw new AppError("not_found", "Shop not found.", { fields: { activeShopId: "You are not a member of that shop." } });
  }
  await updateUser(userId, {
    ...(patch.name !== undefined ? { name: patch.name } : {}),
    ...(patch.unitSystem !== undefined ? { unitSystem: patch.unitSystem } : {}),
    ...(patch.activeShopId !== undefined ? { activeShopId: patch.activeShopId } : {}),
  });
  return getMe(userId);
}
