import type { RequestHandler } from "express";
import { shopIdParamsSchema } from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { AppError } from "../../http/app-error.js";
import { resolveSession } from "./auth.service.js";
import { clearSessionCookie, readSessionCookie } from "./session-cookie.js";
import { verifySessionToken } from "./session-token.js";

/**
 * Requires a valid session cookie; leaves the user in `res.locals.user`. 401 otherwise.
 * With `withShopMembership`, mounted on `/shops/:shopId`, it also reads the caller's membership of
 * that shop in the same database round trip and leaves it (and the shop) where `requireShopRole`
 * looks first; a caller who is not a member is left to `requireShopRole` to refuse.
 */
export function requireSession(config: AppConfig, options: { withShopMembership?: boolean } = {}): RequestHandler {
  return async (req, res, next) => {
    const token = readSessionCookie(req);
    if (!token) throw AppError.unauthenticated("Sign in to continue.");
    try {
      const claims = verifySessionToken(token, config.jwtSecret);
      const shop = options.withShopMembership ? shopIdParamsSchema.safeParse(req.params) : null;
      const { user, membership } = await resolveSession(claims, shop?.success ? shop.data.shopId : null);
      res.locals.user = user;
      if (membership) {
        res.locals.shop = { id: membership.shopId, name: membership.shopName, createdAt: membership.shopCreatedAt };
        res.locals.membership = { shopId: membership.shopId, userId: user.id, role: membership.role };
      }
      res.locals.session = { tokenId: claims.jti, expiresAt: new Date(claims.exp * 1000) };
    } catch (error) {
      // A cookie that can never work again is removed so the browser stops sending it.
      if (error instanceof AppError && error.code === "unauthenticated") clearSessionCookie(res, config);
      throw error;
    }
    next();
  };
}
