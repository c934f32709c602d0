import {
  auditRangeEnd,
  auditRangeStart,
  type AuditAction,
  type AuditEventListQuery,
  type AuditEventPage,
  type AuditSubjectType,
} from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import type { AuditActor } from "./audit-actor.js";
import { insertAuditEvent, listAuditEvents, type AuditFilter } from "./audit.repository.js";

export type { AuditActor } from "./audit-actor.js";

export interface AuditEventInput {
  shopId: string;
  actor: AuditActor;
  action: AuditAction;
  subject: { type: AuditSubjectType; id: string | null; label: string };
  /** A few facts about the change (what it was before and after, counts). Never secrets. */
  detail?: Record<string, unknown>;
}

/** Keys that never belong in the log, whatever a caller passes. */
const SECRET_KEY = /pass(word)?|secret|token|hash|cookie|session|api[-_]?key/i;
/** The table's limit on a detail (bytes of JSON); larger details are replaced by a note. */
const MAX_DETAIL_BYTES = 8192;

function withoutSecrets(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutSecrets);
  if (value instanceof Date) return value.toISOString();
  if (value && typeof value === "object") {
    return Object.fromEntries(
      Object.entries(value)
        .filter(([key, v]) => !SECRET_KEY.test(key) && v !== undefined)
        .map(([key, v]) => [key, withoutSecrets(v)]),
    );
  }
  return value;
}

function safeDetail(detail: Record<string, unknown> | undefined): Record<string, unknown> {
  const clean = withoutSecrets(detail ?? {}) as Record<string, unknown>;
  return Buffer.byteLength(JSON.stringify(clean)) <= MAX_DETAIL_BYTES ? clean : { note: "The details of this change were too large to keep." };
}

/**
 * Records one change in the shop's audit log, inside `tx`: the transaction that makes the change.
 * If the change rolls back, so does its event; if it commits, its event is there. Call it after
 * the change's own checks, once the change is certain (an error thrown later still rolls both back).
 */
export async function recordAuditEvent(tx: Tx, event: AuditEventInput): Promise<void> {
  await insertAuditEvent(
    {
      shopId: event.shopId,
      actorId: event.actor.userId,
      actorName: event.actor.name.slice(0, 200),
      action: event.action,
      subjectType: event.subject.type,
      subjectId: event.subject.id,
      subjectLabel: event.subject.label.slice(0, 300),
      detail: safeDetail(event.detail),
      ip: event.actor.ip,
    },
    tx,
  );
}

/** The keys of `patch` whose value differs from `current`'s (for an "updated" event's detail). */
export function changedFields<T extends object>(patch: Partial<T>, current: T): string[] {
  return (Object.keys(patch) as Array<keyof T>)
    .filter((k) => patch[k] !== undefined && JSON.stringify(patch[k]) !== JSON.stringify(current[k]))
    .map(String);
}

function actionFilter(action: string | undefined): AuditFilter["action"] {
  if (!action) return undefined;
  if (!action.includes(".")) return { prefix: `${action}.` };
  return action.endsWith(".") ? { prefix: action } : { exact: action };
}

export async function listShopAuditEvents(shopId: string, query: AuditEventListQuery): Promise<AuditEventPage> {
  const { items, total } = await listAuditEvents(
    shopId,
    {
      action: actionFilter(query.action),
      subjectType: query.subjectType,
      subjectId: query.subjectId,
      actorId: query.actorId,
      from: query.from ? auditRangeStart(query.from) : undefined,
      before: query.to ? auditRangeEnd(query.to) : undefined,
    },
    query,
  );
  return { items, total, page: query.page, pageSize: query.pageSize };
}
