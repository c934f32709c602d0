import type { RequestHandler } from "express";
import { roleLabels, roles, shopIdParamsSchema, type Role } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentUser } from "../../http/locals.js";
import { findMembership } from "./shops.repository.js";

/** `roles` lists the most privileged first; a lower index means more rights. */
export function roleAtLeast(role: Role, minimum: Role): boolean {
  return roles.indexOf(role) <= roles.indexOf(minimum);
}

/** "the owner", "an owner or tooling manager"… for error messages. */
function describe(allowed: Role | readonly Role[]): string {
  const list = typeof allowed === "string" ? roles.filter((r) => roleAtLeast(r, allowed)) : [...allowed];
  if (list.length === 1 && list[0] === "owner") return "the owner";
  const words = list.map((r) => roleLabels[r].toLowerCase()).join(" or ");
  return `${/^[aeiou]/.test(words) ? "an" : "a"} ${words}`;
}

/**
 * The one authorization middleware for shop routes. Mounted on `/api/shops/:shopId` (any member)
 * and again on routes that need more (`requireShopRole("owner")`, or a list of roles).
 * - Loads the caller's membership of `:shopId` once per request into `res.locals.shop` and
 *   `res.locals.membership`.
 * - Answers 404 when the caller is not a member, exactly as for a shop that does not exist, so the
 *   existence of other shops is never revealed.
 * - Answers 403 when the caller is a member whose role is not allowed.
 */
export function requireShopRole(allowed: Role | readonly Role[]): RequestHandler {
  return async (req, res, next) => {
    const user = currentUser(res);
    const params = shopIdParamsSchema.safeParse(req.params);
    if (!params.success) throw AppError.notFound("Shop not found.");
    const { shopId } = params.data;

    let membership = res.locals.membership;
    if (membership?.shopId !== shopId || membership.userId !== user.id) {
      const found = await findMembership(shopId, user.id);
      if (!found) throw AppError.notFound("Shop not found.");
      membership = { shopId: found.shopId, userId: found.userId, role: found.role };
      res.locals.shop = { id: found.shopId, name: found.shopName, createdAt: found.shopCreatedAt };
      res.locals.membership = membership;
    }

    const role = membership.role;
    const ok = typeof allowed === "string" ? roleAtLeast(role, allowed) : allowed.includes(role);
    if (!ok) throw AppError.forbidden(`Only ${describe(allowed)} of this shop can do this.`);
    next();
  };
}
