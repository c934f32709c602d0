import type { Response } from "express";
import type { Role } from "@ringdown/contracts";
import { AppError } from "./app-error.js";

/** The signed-in person, as `requireSession` leaves it in `res.locals.user`. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  sessionVersion: number;
}

/** The session token's own claims (needed to sign out this one session). */
export interface SessionInfo {
  tokenId: string;
  expiresAt: Date;
}

/** The shop of a `/api/shops/:shopId/...` request and the caller's place in it. */
export interface ShopContext {
  id: string;
  name: string;
  createdAt: Date;
}
export interface MembershipContext {
  shopId: string;
  userId: string;
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      requestId?: string;
      user?: SessionUser;
      session?: SessionInfo;
      shop?: ShopContext;
      membership?: MembershipContext;
    }
  }
}

export function currentUser(res: Response): SessionUser {
  const user = res.locals.user;
  if (!user) throw AppError.unauthenticated();
  return user;
}

export function currentShop(res: Response): { shop: ShopContext; membership: MembershipContext } {
  const { shop, membership } = res.locals;
  if (!shop || !membership) throw new Error("currentShop() used outside a shop-scoped route");
  return { shop, membership };
}
