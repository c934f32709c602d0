import { QueryTypes } from "sequelize";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { UserModel } from "../users/user.model.js";

export interface ResetTokenRecord {
  id: string;
  userId: string;
  expiresAt: Date;
  usedAt: Date | null;
}

interface Row {
  id: string;
  user_id: string;
  expires_at: Date;
  used_at: Date | null;
}

const toRecord = (r: Row): ResetTokenRecord => ({
  id: r.id,
  userId: r.user_id,
  expiresAt: new Date(r.expires_at),
  usedAt: r.used_at ? new Date(r.used_at) : null,
});

/** A new link for the user; their earlier unused links stop working (only the latest counts). */
export async function replaceResetToken(userId: string, tokenHash: string, expiresAt: Date, tx: Tx): Promise<void> {
  await getSequelize().query(`DELETE FROM password_reset_tokens WHERE user_id = $1 AND used_at IS NULL`, { bind: [userId], transaction: tx });
  await getSequelize().query(`INSERT INTO password_reset_tokens (user_id, token_hash, expires_at) VALUES ($1, $2, $3)`, {
    bind: [userId, tokenHash, expiresAt],
    transaction: tx,
  });
}

/** The link's record (locked for the rest of `tx` when given). */
export async function findResetToken(tokenHash: string, tx?: Tx): Promise<ResetTokenRecord | null> {
  const rows = await getSequelize().query<Row>(
    `SELECT id, user_id, expires_at, used_at FROM password_reset_tokens WHERE token_hash = $1${tx ? " FOR UPDATE" : ""}`,
    { bind: [tokenHash], type: QueryTypes.SELECT, transaction: tx ?? null },
  );
  return rows[0] ? toRecord(rows[0]) : null;
}

export async function markResetTokenUsed(id: string, tx: Tx): Promise<void> {
  await getSequelize().query(`UPDATE password_reset_tokens SET used_at = now() WHERE id = $1`, { bind: [id], transaction: tx });
}

export async function setPasswordHash(userId: string, passwordHash: string, tx: Tx): Promise<void> {
  await UserModel.update({ passwordHash }, { where: { id: userId }, transaction: tx });
}

/** Test support: moves a link's expiry. */
export async function setResetTokenExpiry(tokenHash: string, expiresAt: Date): Promise<void> {
  await getSequelize().query(`UPDATE password_reset_tokens SET expires_at = $2 WHERE token_hash = $1`, { bind: [tokenHash, expiresAt] });
}
