import { z } from "zod";
import { pageOf, paginationQuerySchema } from "./pagination.js";

/**
 * The shop's audit log: who changed what, and when. Each action is a stable dotted code
 * (`<subject>.<what happened>`); new codes are appended, existing ones never renamed, since stored
 * events keep theirs.
 */
export const auditActions = [
  "shop.created",
  "shop.renamed",
  "shop.exported",
  "member.role_changed",
  "member.removed",
  "invitation.sent",
  "invitation.revoked",
  "invitation.accepted",
  "billing.checkout_started",
  "billing.plan_changed",
  "cutter.created",
  "cutter.updated",
  "cutter.status_changed",
  "cutter.deleted",
  "cutter.restored",
  "cutter.imported",
  "material.created",
  "material.copied",
  "material.updated",
  "material.deleted",
  "material.restored",
  "machine.created",
  "machine.updated",
  "machine.deleted",
  "machine.restored",
  "machine.ceilings_changed",
  "stiffness_reading.added",
  "stiffness_reading.deleted",
  "backlash_reading.added",
  "backlash_reading.deleted",
  "mode.added",
  "mode.updated",
  "mode.deleted",
  "recording.uploaded",
  "recording.deleted",
  "recording.mode_accepted",
  "recording.dial_rpm_accepted",
  "recipe.created",
  "recipe.revised",
  "recipe.status_changed",
  "recipe.deleted",
  "recipe.restored",
  "recipe.copied",
  "cut_log.created",
] as const;
export const auditActionSchema = z.enum(auditActions);
export type AuditAction = z.infer<typeof auditActionSchema>;

/** What an event is about. */
export const auditSubjectTypes = [
  "shop",
  "member",
  "invitation",
  "subscription",
  "cutter",
  "material",
  "machine",
  "stiffness_reading",
  "backlash_reading",
  "mode",
  "recording",
  "recipe",
  "cut_log",
] as const;
export const auditSubjectTypeSchema = z.enum(auditSubjectTypes);
export type AuditSubjectType = z.infer<typeof auditSubjectTypeSchema>;

/** One recorded change, as GET /api/shops/:shopId/audit-events lists it (newest first). */
export const auditEventSchema = z.object({
  id: z.string().uuid(),
  action: auditActionSchema,
  /** Null when the person's account is gone or the change came from outside (the payment provider). */
  actorId: z.string().uuid().nullable(),
  /** The actor's name when the change was made. */
  actorName: z.string(),
  subjectType: auditSubjectTypeSchema,
  subjectId: z.string().nullable(),
  /** The subject's name when the change was made. */
  subjectLabel: z.string(),
  /** A few facts about the change (values before and after, counts); never secrets. */
  detail: z.record(z.string(), z.unknown()),
  ip: z.string().nullable(),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditEventPageSchema = pageOf(auditEventSchema);
export type AuditEventPage = z.infer<typeof auditEventPageSchema>;

/** A date ("2025-03-01") or an ISO date-time with its offset. */
const instant = z
  .string()
  .trim()
  .refine((v) => /^\d{4}-\d{2}-\d{2}(T[\d:.]+(Z|[+-]\d{2}:\d{2}))?$/.test(v) && !Number.isNaN(new Date(v).getTime()), {
    message: "Use a date like 2025-03-01 or an ISO date-time with its offset",
  });

/**
 * Filters of the audit list. `action` is a code or its start ("recipe." for every recipe event);
 * `from` and `to` bound `createdAt` (a bare date in `to` includes that whole day, UTC).
 */
export const auditEventListQuerySchema = paginationQuerySchema
  .extend({
    action: z
      .string()
      .trim()
      .max(60)
      .regex(/^[a-z_]+(\.[a-z_]*)?$/, "Use an action code such as recipe.status_changed, or its start such as recipe.")
      .optional(),
    subjectType: auditSubjectTypeSchema.optional(),
    subjectId: z.string().trim().uuid("Use a record id").optional(),
    actorId: z.string().trim().uuid("Use a person's id").optional(),
    from: instant.optional(),
    to: instant.optional(),
  })
  .refine((q) => !q.from || !q.to || auditRangeStart(q.from) < auditRangeEnd(q.to), {
    message: "The start of the period must not be after its end",
    path: ["to"],
  });
export type AuditEventListQuery = z.infer<typeof auditEventListQuerySchema>;

/** The first instant a `from` filter admits. */
export function auditRangeStart(from: string): Date {
  return new Date(from.length === 10 ? `${from}T00:00:00Z` : from);
}

/** The first instant a `to` filter no longer admits (a bare date covers its whole day, UTC). */
export function auditRangeEnd(to: string): Date {
  if (to.length === 10) return new Date(new Date(`${to}T00:00:00Z`).getTime() + 24 * 3600_000);
  return new Date(new Date(to).getTime() + 1);
}
