/**
 * Data access for the audit log: plain SQL, plain objects out. Rows are only ever inserted (in the
 * transaction of the change they record) and listed; nothing updates or deletes them but the
 * shop's own deletion.
 */
import { QueryTypes } from "sequelize";
import type { AuditAction, AuditEvent, AuditSubjectType } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";

export interface NewAuditEvent {
  shopId: string;
  actorId: string | null;
  actorName: string;
  action: AuditAction;
  subjectType: AuditSubjectType;
  subjectId: string | null;
  subjectLabel: string;
  detail: Record<string, unknown>;
  ip: string | null;
}

export async function insertAuditEvent(event: NewAuditEvent, tx: Tx): Promise<void> {
  // clock_timestamp(), not now(): several events of one transaction keep the order they happened in.
  await getSequelize().query(
    `INSERT INTO audit_events (shop_id, actor_id, actor_name, action, subject_type, subject_id, subject_label, detail, ip, created_at)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8::jsonb, $9::inet, clock_timestamp())`,
    {
      bind: [
        event.shopId,
        event.actorId,
        event.actorName,
        event.action,
        event.subjectType,
        event.subjectId,
        event.subjectLabel,
        JSON.stringify(event.detail),
        event.ip,
      ],
      transaction: tx,
    },
  );
}

export interface AuditFilter {
  /** An action code, or a prefix ending in "." (every event of that subject). */
  action?: { exact: string } | { prefix: string } | undefined;
  subjectType?: AuditSubjectType | undefined;
  subjectId?: string | undefined;
  actorId?: string | undefined;
  /** createdAt ≥ from. */
  from?: Date | undefined;
  /** createdAt < before. */
  before?: Date | undefined;
}

interface AuditRow {
  id: string;
  action: AuditAction;
  actor_id: string | null;
  actor_name: string;
  subject_type: AuditSubjectType;
  subject_id: string | null;
  subject_label: string;
  detail: Record<string, unknown>;
  ip: string | null;
  created_at: Date;
}

/** `LIKE` pattern matching text that starts with `prefix` literally. */
const startsWith = (prefix: string) => `${prefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** One page of the shop's events, newest first (always filtered by the shop). */
export async function listAuditEvents(
  shopId: string,
  filter: AuditFilter,
  page: { page: number; pageSize: number },
): Promise<{ items: AuditEvent[]; total: number }> {
  const where = ["shop_id = $1"];
  const bind: unknown[] = [shopId];
  const add = (sql: (n: string) => string, value: unknown) => {
    bind.push(value);
    where.push(sql(`$${bind.length}`));
  };
  if (filter.action && "exact" in filter.action) add((n) => `action = ${n}`, filter.action.exact);
  if (filter.action && "prefix" in filter.action) add((n) => `action LIKE ${n}`, startsWith(filter.action.prefix));
  if (filter.subjectType) add((n) => `subject_type = ${n}`, filter.subjectType);
  if (filter.subjectId) add((n) => `subject_id = ${n}`, filter.subjectId);
  if (filter.actorId) add((n) => `actor_id = ${n}`, filter.actorId);
  if (filter.from) add((n) => `created_at >= ${n}`, filter.from);
  if (filter.before) add((n) => `created_at < ${n}`, filter.before);
  const sequelize = getSequelize();
  const whereSql = where.join(" AND ");
  const [counted] = await sequelize.query<{ n: number }>(`SELECT count(*) AS n FROM audit_events WHERE ${whereSql}`, {
    bind,
    type: QueryTypes.SELECT,
  });
  const rows = await sequelize.query<AuditRow>(
    `SELECT id, action, actor_id, actor_name, subject_type, subject_id, subject_label, detail, host(ip) AS ip, created_at
       FROM audit_events WHERE ${whereSql}
      ORDER BY created_at DESC, id DESC
      LIMIT $${bind.length + 1} OFFSET $${bind.length + 2}`,
    { bind: [...bind, page.pageSize, (page.page - 1) * page.pageSize], type: QueryTypes.SELECT },
  );
  return {
    total: counted?.n ?? 0,
    items: rows.map((r) => ({
      id: r.id,
      action: r.action,
      actorId: r.actor_id,
      actorName: r.actor_name,
      subjectType: r.subject_type,
      subjectId: r.subject_id,
      subjectLabel: r.subject_label,
      detail: r.detail,
      ip: r.ip,
      createdAt: new Date(r.created_at).toISOString(),
    })),
  };
}
