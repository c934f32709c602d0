import type { LoginBody, SignupBody } from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import type { SessionUser } from "../../http/locals.js";
import { createShopWithOwner } from "../shops/shops.repository.js";
import { recordAuditEvent } from "../audit/audit.service.js";
import {
  createUser,
  findCredentialsByEmail,
  findUserIdByEmail,
  updateUser,
} from "../users/users.repository.js";
import { findSessionHolder, revokeSession, type SessionHolder } from "./auth.repository.js";
import { burnPasswordCheck, hashPassword, verifyPassword } from "./password.js";
import type { SessionClaims } from "./session-token.js";

const EMAIL_TAKEN = "An account with this e-mail address already exists. Sign in instead.";

/** Creates the user, their first shop (they own it) and makes it their active shop. */
/** A new account with its own new shop; `ip` is where the request came from (for the shop's audit log). */
export async function signUp(body: SignupBody, ip: string | null = null): Promise<{ id: string; sessionVersion: number }> {
  // Hash before the transaction: it takes a few hundred milliseconds by design.
  const passwordHash = await hashPassword(body.password);
  return inTransaction(async (tx) => {
    if (await findUserIdByEmail(body.email, tx)) {
      throw AppError.conflict(EMAIL_TAKEN, { email: EMAIL_TAKEN });
    }
    const user = await createUser({ email: body.email, name: body.name, passwordHash }, tx);
    const shop = await createShopWithOwner({ name: body.shopName, ownerId: user.id }, tx);
    await updateUser(user.id, { activeShopId: shop.id }, tx);
    await recordAuditEvent(tx, {
      shopId: shop.id,
      actor: { userId: user.id, name: user.name, ip },
      action: "shop.created",
      subject: { type: "shop", id: shop.id, label: shop.name },
    });
    return { id: user.id, sessionVersion: user.sessionVersion };
  });
}

/** Checks e-mail and password; the same message for an unknown address and a wrong password. */
export async function logIn(body: LoginBody): Promise<{ id: string; sessionVersion: number }> {
  const credentials = await findCredentialsByEmail(body.email);
  if (!credentials) {
    await burnPasswordCheck(body.password);
    throw AppError.unauthenticated("The e-mail address or password is incorrect.");
  }
  if (!(await verifyPassword(body.password, credentials.passwordHash))) {
    throw AppError.unauthenticated("The e-mail address or password is incorrect.");
  }
  return { id: credentials.id, sessionVersion: credentials.sessionVersion };
}

/**
 * The user behind a verified token, provided the token was not signed out and was issued for the
 * user's current session version; with `shopId`, also the user's membership of that shop (null
 * when not a member), read in the same round trip.
 */
export async function resolveSession(
  claims: SessionClaims,
  shopId: string | null = null,
): Promise<{ user: SessionUser; membership: SessionHolder["membership"] }> {
  const holder = await findSessionHolder(claims.sub, claims.jti, shopId);
  if (!holder || holder.revoked || holder.sessionVersion !== claims.sv) {
    throw AppError.unauthenticated("Your session has ended. Sign in again.");
  }
  return {
    user: { id: holder.id, email: holder.email, name: holder.name, sessionVersion: holder.sessionVersion },
    membership: holder.membership,
  };
}

/** Signs out one session: its token is refused from now on. */
export async function logOut(claims: SessionClaims): Promise<void> {
  await revokeSession(claims.jti, new Date(claims.exp * 1000));
}
