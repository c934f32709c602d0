import type { PasswordResetLink } from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { hashLinkToken, newLinkToken } from "../auth/link-token.js";
import { hashPassword } from "../auth/password.js";
import { sendInBackground } from "../mail/background.js";
import type { Mailer } from "../mail/mailer.js";
import { passwordResetMail } from "../mail/templates.js";
import { bumpSessionVersion, findUserById, findUserIdByEmail } from "../users/users.repository.js";
import { findResetToken, markResetTokenUsed, replaceResetToken, setPasswordHash } from "./password-reset.repository.js";

/** How long a reset link works. */
export const RESET_TTL_MS = 60 * 60 * 1000;

/**
 * Sends a reset link when the address has an account, and does nothing otherwise. The caller
 * answers the same way in both cases; the e-mail goes out in the background so the answer takes
 * no longer for a real account (no account enumeration by timing either).
 */
export async function requestPasswordReset(email: string, deps: { config: AppConfig; mailer: Mailer }): Promise<void> {
  const userId = await findUserIdByEmail(email);
  if (!userId) return;
  const user = await findUserById(userId);
  if (!user) return;
  const { token, hash } = newLinkToken();
  const expiresAt = new Date(Date.now() + RESET_TTL_MS);
  await inTransaction((tx) => replaceResetToken(user.id, hash, expiresAt, tx));
  sendInBackground(
    deps.mailer,
    passwordResetMail({ to: user.email, name: user.name, url: `${deps.config.appOrigin}/reset-password/${token}`, expiresAt }),
  );
}

const INVALID = "This password-reset link is not valid. Check that it was copied completely, or ask for a new one.";
const USED = "This password-reset link has already been used. Ask for a new one if you need it.";
const EXPIRED = "This password-reset link has expired (links work for 1 hour). Ask for a new one.";

export async function describeResetLink(token: string): Promise<PasswordResetLink> {
  const found = await findResetToken(hashLinkToken(token));
  if (!found) throw AppError.notFound(INVALID);
  const status = found.usedAt ? "used" : found.expiresAt.getTime() <= Date.now() ? "expired" : "valid";
  return { status, expiresAt: found.expiresAt.toISOString() };
}

function assertResetTokenUsable<T extends { usedAt: Date | null; expiresAt: Date }>(found: T | null): T {
  if (!found) throw AppError.notFound(INVALID);
  if (found.usedAt) throw AppError.conflict(USED);
  if (found.expiresAt.getTime() <= Date.now()) throw AppError.conflict(EXPIRED);
  return found;
}

/**
 * Sets the new password once per link and ends every session of the person (the caller signs in
 * the browser that made the change with a fresh session).
 */
export async function resetPassword(token: string, password: string): Promise<{ id: string; sessionVersion: number }> {
  const tokenHash = hashLinkToken(token);
  // A link that cannot work is refused before the deliberately slow password hash, so made-up
  // links cost the server nothing; the check is repeated under the row lock below.
  assertResetTokenUsable(await findResetToken(tokenHash));
  const passwordHash = await hashPassword(password);
  return inTransaction(async (tx) => {
    const found = assertResetTokenUsable(await findResetToken(tokenHash, tx));
    await setPasswordHash(found.userId, passwordHash, tx);
    await markResetTokenUsed(found.id, tx);
    await bumpSessionVersion(found.userId, tx);
    const user = await findUserById(found.userId, tx);
    if (!user) throw AppError.notFound(INVALID);
    return { id: user.id, sessionVersion: user.sessionVersion };
  });
}
