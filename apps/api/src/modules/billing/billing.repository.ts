/**
 * Data access for plans and seats: the shop's subscription row, the processed webhook events and
 * the counts seat rules need. Plain objects out; plain SQL because the rules need row locks.
 */
import { QueryTypes } from "sequelize";
import type { SubscriptionStatus } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";

export interface SubscriptionRecord {
  shopId: string;
  providerCustomerId: string | null;
  providerSubscriptionId: string | null;
  providerSubscriptionItemId: string | null;
  status: SubscriptionStatus;
  seats: number;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
}

export interface ShopUsage {
  owners: number;
  toolingManagers: number;
  programmers: number;
  operators: number;
  /** Open, unexpired invitations for paid roles. */
  pendingPaidInvitations: number;
  /** Machines not in the bin. */
  machines: number;
}

interface SubscriptionRow {
  shop_id: string;
  provider_customer_id: string | null;
  provider_subscription_id: string | null;
  provider_subscription_item_id: string | null;
  status: SubscriptionStatus;
  seats: number;
  current_period_end: Date | null;
  cancel_at_period_end: boolean;
}

const toRecord = (r: SubscriptionRow): SubscriptionRecord => ({
  shopId: r.shop_id,
  providerCustomerId: r.provider_customer_id,
  providerSubscriptionId: r.provider_subscription_id,
  providerSubscriptionItemId: r.provider_subscription_item_id,
  status: r.status,
  seats: r.seats,
  currentPeriodEnd: r.current_period_end ? new Date(r.current_period_end) : null,
  cancelAtPeriodEnd: r.cancel_at_period_end,
});

const opts = (tx: Tx | undefined, bind: unknown[]) => ({ bind, type: QueryTypes.SELECT, transaction: tx ?? null }) as const;

/**
 * Locks the shop row until the transaction ends, so seat checks and the changes they allow
 * (an invitation, a role change, a member removed) happen one at a time per shop. NO KEY UPDATE,
 * not UPDATE: rows inserted elsewhere that reference the shop (an audit event, a machine) take a
 * KEY SHARE lock on it for their foreign key, and must not wait for, or deadlock with, this one.
 */
export async function lockShop(shopId: string, tx: Tx): Promise<boolean> {
  const rows = await getSequelize().query(`SELECT id FROM shops WHERE id = $1 FOR NO KEY UPDATE`, opts(tx, [shopId]));
  return rows.length > 0;
}

export async function findSubscription(shopId: string, tx?: Tx): Promise<SubscriptionRecord | null> {
  const rows = await getSequelize().query<SubscriptionRow>(`SELECT * FROM shop_subscriptions WHERE shop_id = $1`, opts(tx, [shopId]));
  return rows[0] ? toRecord(rows[0]) : null;
}

export async function findShopIdBySubscription(providerSubscriptionId: string, tx?: Tx): Promise<string | null> {
  const rows = await getSequelize().query<{ shop_id: string }>(
    `SELECT shop_id FROM shop_subscriptions WHERE provider_subscription_id = $1`,
    opts(tx, [providerSubscriptionId]),
  );
  return rows[0]?.shop_id ?? null;
}

export async function findShopIdByCustomer(providerCustomerId: string, tx?: Tx): Promise<string | null> {
  const rows = await getSequelize().query<{ shop_id: string }>(
    `SELECT shop_id FROM shop_subscriptions WHERE provider_customer_id = $1`,
    opts(tx, [providerCustomerId]),
  );
  return rows[0]?.shop_id ?? null;
}

/** Creates the row or changes the given fields (others keep their values). */
export async function saveSubscription(shopId: string, patch: Partial<Omit<SubscriptionRecord, "shopId">>, tx?: Tx): Promise<void> {
  const columns: Record<keyof Omit<SubscriptionRecord, "shopId">, string> = {
    providerCustomerId: "provider_customer_id",
    providerSubscriptionId: "provider_subscription_id",
    providerSubscriptionItemId: "provider_subscription_item_id",
    status: "status",
    seats: "seats",
    currentPeriodEnd: "current_period_end",
    cancelAtPeriodEnd: "cancel_at_period_end",
  };
  const entries = Object.entries(patch).filter(([, v]) => v !== undefined) as Array<[keyof typeof columns, unknown]>;
  const names = entries.map(([k]) => columns[k]);
  const values = entries.map(([, v]) => v);
  const insertCols = ["shop_id", ...names].join(", ");
  const placeholders = ["$1", ...names.map((_, i) => `$${i + 2}`)].join(", ");
  const updates = [...names.map((n) => `${n} = EXCLUDED.${n}`), "updated_at = now()"].join(", ");
  await getSequelize().query(
    `INSERT INTO shop_subscriptions (${insertCols}) VALUES (${placeholders})
     ON CONFLICT (shop_id) DO UPDATE SET ${updates}`,
    { bind: [shopId, ...values], transaction: tx ?? null },
  );
}

export async function countUsage(shopId: string, tx?: Tx): Promise<ShopUsage> {
  const [row] = await getSequelize().query<{
    owners: number;
    tooling_managers: number;
    programmers: number;
    operators: number;
    pending: number;
    machines: number;
  }>(
    `SELECT
       (SELECT count(*) FROM memberships WHERE shop_id = $1 AND role = 'owner') AS owners,
       (SELECT count(*) FROM memberships WHERE shop_id = $1 AND role = 'tooling_manager') AS tooling_managers,
       (SELECT count(*) FROM memberships WHERE shop_id = $1 AND role = 'programmer') AS programmers,
       (SELECT count(*) FROM memberships WHERE shop_id = $1 AND role = 'operator') AS operators,
       (SELECT count(*) FROM invitations WHERE shop_id = $1 AND role <> 'operator'
          AND accepted_at IS NULL AND revoked_at IS NULL AND expires_at > now()) AS pending,
       (SELECT count(*) FROM machines WHERE shop_id = $1 AND deleted_at IS NULL) AS machines`,
    opts(tx, [shopId]),
  );
  return {
    owners: row?.owners ?? 0,
    toolingManagers: row?.tooling_managers ?? 0,
    programmers: row?.programmers ?? 0,
    operators: row?.operators ?? 0,
    pendingPaidInvitations: row?.pending ?? 0,
    machines: row?.machines ?? 0,
  };
}

/**
 * Records a webhook event id; false when it was recorded before (a replay). Inside the caller's
 * transaction, so a failed processing run leaves no record and the provider's retry is handled.
 */
export async function recordEvent(eventId: string, type: string, tx: Tx): Promise<boolean> {
  const rows = await getSequelize().query(
    `INSERT INTO billing_events (event_id, type) VALUES ($1, $2) ON CONFLICT (event_id) DO NOTHING RETURNING event_id`,
    opts(tx, [eventId, type]),
  );
  return rows.length > 0;
}

export async function setEventShop(eventId: string, shopId: string, tx: Tx): Promise<void> {
  await getSequelize().query(`UPDATE billing_events SET shop_id = $2 WHERE event_id = $1`, {
    bind: [eventId, shopId],
    transaction: tx,
  });
}

export async function shopName(shopId: string): Promise<string | null> {
  const rows = await getSequelize().query<{ name: string }>(`SELECT name FROM shops WHERE id = $1`, opts(undefined, [shopId]));
  return rows[0]?.name ?? null;
}
