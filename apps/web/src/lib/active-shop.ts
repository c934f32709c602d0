import type { Role } from "@ringdown/contracts";
import { activeMembership, useMe } from "./auth";

export interface ActiveShop {
  shopId: string;
  shopName: string;
  role: Role;
  userId: string;
}

/**
 * The shop the signed-in person is working in, with their role there; null before the person is
 * known or when they belong to no shop. Pages under the signed-in layout can rely on `me` loaded.
 */
export function useActiveShop(): ActiveShop | null {
  const { data: me } = useMe();
  if (!me) return null;
  const membership = activeMembership(me);
  if (!membership) return null;
  return { shopId: membership.shopId, shopName: membership.shopName, role: membership.role, userId: me.user.id };
}

/** `/shops/<id><path>`: the prefix of every shop-scoped API route. */
export function shopApiPath(shopId: string, path: string): string {
  return `/shops/${encodeURIComponent(shopId)}${path}`;
}

/** Query-string from a plain object, leaving out empty values (undefined, null, ""). */
export function toSearch(params: Record<string, string | number | boolean | null | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === "") continue;
    search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : "";
}
