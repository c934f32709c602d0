import { Op } from "sequelize";
import type { Role } from "@ringdown/contracts";
import { preparedSelect } from "../../db/prepared.js";
import { RevokedSessionModel } from "./revoked-session.model.js";

/** What a request's session cookie stands for, read in one round trip. */
export interface SessionHolder {
  id: string;
  email: string;
  name: string;
  sessionVersion: number;
  /** The token was signed out. */
  revoked: boolean;
  /** The holder's membership of the shop asked about, or null (not a member, or none asked). */
  membership: { shopId: string; shopName: string; shopCreatedAt: Date; role: Role } | null;
}

/**
 * The user `userId`, whether the token `tokenId` was signed out and, when `shopId` is given, the
 * user's membership of that shop: every request on a shop's route needs all three, so they come
 * back from one (prepared) statement instead of three. Null when there is no such user.
 */
export async function findSessionHolder(userId: string, tokenId: string, shopId: string | null): Promise<SessionHolder | null> {
  const [row] = await preparedSelect<{
    id: string;
    email: string;
    name: string;
    session_version: number;
    revoked: boolean;
    role: Role | null;
    shop_id: string | null;
    shop_name: string | null;
    shop_created_at: Date | null;
  }>(
    `SELECT u.id, u.email, u.name, u.session_version,
            EXISTS (SELECT 1 FROM revoked_sessions rs WHERE rs.token_id = :tokenId) AS revoked,
            m.role, s.id AS shop_id, s.name AS shop_name, s.created_at AS shop_created_at
       FROM users u
       LEFT JOIN memberships m ON m.user_id = u.id AND m.shop_id = :shopId
       LEFT JOIN shops s ON s.id = m.shop_id
      WHERE u.id = :userId`,
    { userId, tokenId, shopId },
  );
  if (!row) return null;
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    sessionVersion: row.session_version,
    revoked: row.revoked,
    membership:
      row.role && row.shop_id && row.shop_name !== null && row.shop_created_at
        ? { shopId: row.shop_id, shopName: row.shop_name, shopCreatedAt: row.shop_created_at, role: row.role }
        : null,
  };
}

/** Records a signed-out token until its own expiry, and drops records that expired already. */
export async function revokeSession(tokenId: string, expiresAt: Date): Promise<void> {
  await RevokedSessionModel.upsert({ tokenId, expiresAt });
  await RevokedSessionModel.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } });
}
