import { QueryTypes } from "sequelize";
import type { InvitationStatus, Role } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";

export interface InvitationRecord {
  id: string;
  shopId: string;
  shopName: string;
  email: string;
  role: Role;
  invitedByName: string | null;
  sentAt: Date;
  expiresAt: Date;
  status: InvitationStatus;
}

interface Row {
  id: string;
  shop_id: string;
  shop_name: string;
  email: string;
  role: Role;
  invited_by_name: string | null;
  sent_at: Date;
  expires_at: Date;
  status: InvitationStatus;
}

const toRecord = (r: Row): InvitationRecord => ({
  id: r.id,
  shopId: r.shop_id,
  shopName: r.shop_name,
  email: r.email,
  role: r.role,
  invitedByName: r.invited_by_name,
  sentAt: new Date(r.sent_at),
  expiresAt: new Date(r.expires_at),
  status: r.status,
});

const SELECT = `
  SELECT i.id, i.shop_id, s.name AS shop_name, i.email, i.role, u.name AS invited_by_name, i.sent_at, i.expires_at,
         CASE WHEN i.accepted_at IS NOT NULL THEN 'accepted'
              WHEN i.revoked_at IS NOT NULL THEN 'revoked'
              WHEN i.expires_at <= now() THEN 'expired'
              ELSE 'pending' END AS status
  FROM invitations i
  JOIN shops s ON s.id = i.shop_id
  LEFT JOIN users u ON u.id = i.invited_by`;

const select = (tx: Tx | undefined, bind: unknown[]) => ({ bind, type: QueryTypes.SELECT, transaction: tx ?? null }) as const;

/** Open invitations (pending or expired, neither accepted nor revoked), newest first. */
export async function listOpenInvitations(shopId: string): Promise<InvitationRecord[]> {
  const rows = await getSequelize().query<Row>(
    `${SELECT} WHERE i.shop_id = $1 AND i.accepted_at IS NULL AND i.revoked_at IS NULL ORDER BY i.sent_at DESC, i.id`,
    select(undefined, [shopId]),
  );
  return rows.map(toRecord);
}

export async function findOpenInvitation(shopId: string, where: { id: string } | { email: string }, tx?: Tx): Promise<InvitationRecord | null> {
  const [column, value] = "id" in where ? ["i.id", where.id] : ["i.email", where.email];
  const rows = await getSequelize().query<Row>(
    `${SELECT} WHERE i.shop_id = $1 AND ${column} = $2 AND i.accepted_at IS NULL AND i.revoked_at IS NULL`,
    select(tx, [shopId, value]),
  );
  return rows[0] ? toRecord(rows[0]) : null;
}

/** The invitation behind a link (any status), locked for the rest of `tx` when given. */
export async function findInvitationByTokenHash(hash: string, tx?: Tx): Promise<InvitationRecord | null> {
  const rows = await getSequelize().query<Row>(`${SELECT} WHERE i.token_hash = $1${tx ? " FOR UPDATE OF i" : ""}`, select(tx, [hash]));
  return rows[0] ? toRecord(rows[0]) : null;
}

export async function insertInvitation(
  input: { shopId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
  tx: Tx,
): Promise<string> {
  const rows = await getSequelize().query<{ id: string }>(
    `INSERT INTO invitations (shop_id, email, role, token_hash, invited_by, expires_at)
     VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
    select(tx, [input.shopId, input.email, input.role, input.tokenHash, input.invitedBy, input.expiresAt]),
  );
  return rows[0]!.id;
}

/** Withdraws an open invitation; false when there was none with that id in the shop. */
export async function revokeInvitation(shopId: string, id: string, tx?: Tx): Promise<boolean> {
  const rows = await getSequelize().query(
    `UPDATE invitations SET revoked_at = now(), updated_at = now()
     WHERE shop_id = $1 AND id = $2 AND accepted_at IS NULL AND revoked_at IS NULL RETURNING id`,
    select(tx, [shopId, id]),
  );
  return rows.length > 0;
}

export async function markInvitationAccepted(id: string, userId: string, tx: Tx): Promise<void> {
  await getSequelize().query(`UPDATE invitations SET accepted_at = now(), accepted_by = $2, updated_at = now() WHERE id = $1`, {
    bind: [id, userId],
    transaction: tx,
  });
}

/** Test support: moves an invitation's expiry (e.g. into the past). */
export async function setInvitationExpiry(id: string, expiresAt: Date): Promise<void> {
  await getSequelize().query(`UPDATE invitations SET expires_at = $2 WHERE id = $1`, { bind: [id, expiresAt] });
}
