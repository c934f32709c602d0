import { z } from "zod";
import { emailSchema, passwordSchema, personNameSchema } from "./auth.js";
import { roleSchema, type Role } from "./roles.js";

/**
 * Roles that take a paid seat: the people who edit the library. Operators read recipes and log
 * cuts from the floor; they are free and unlimited on every plan.
 */
export const paidRoles = ["owner", "tooling_manager", "programmer"] as const satisfies readonly Role[];

export function isPaidRole(role: Role): boolean {
  return (paidRoles as readonly Role[]).includes(role);
}

/** Route parameter of the member routes (`/members/:userId`). */
export const memberParamsSchema = z.object({ userId: z.string().uuid("Unknown member") });

/** PATCH /api/shops/:shopId/members/:userId (owners). */
export const updateMemberBodySchema = z.object({ role: roleSchema });
export type UpdateMemberBody = z.infer<typeof updateMemberBodySchema>;

// --- invitations ---------------------------------------------------------------------------

/**
 * pending: can be accepted · expired: past its 7 days · accepted: used · revoked: withdrawn by an
 * owner, or replaced by a newer link.
 */
export const invitationStatusSchema = z.enum(["pending", "expired", "accepted", "revoked"]);
export type InvitationStatus = z.infer<typeof invitationStatusSchema>;

/** An invitation as the shop's owners see it. */
export const invitationSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  role: roleSchema,
  status: invitationStatusSchema,
  invitedByName: z.string().nullable(),
  /** When the current link stops working (ISO 8601). */
  expiresAt: z.string(),
  /** When the current link was sent (ISO 8601). */
  sentAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** GET /api/shops/:shopId/invitations: pending and expired invitations, newest first. */
export const invitationListSchema = z.object({ items: z.array(invitationSchema) });
export type InvitationList = z.infer<typeof invitationListSchema>;

/** POST /api/shops/:shopId/invitations (owners). Inviting an address again re-sends with a new link. */
export const createInvitationBodySchema = z.object({ email: emailSchema, role: roleSchema });
export type CreateInvitationBody = z.infer<typeof createInvitationBodySchema>;

export const invitationParamsSchema = z.object({ invitationId: z.string().uuid("Unknown invitation") });

/** Link tokens: 32 random bytes, base64url (43 characters). */
export const linkTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This link is not valid");
export const linkTokenParamsSchema = z.object({ token: linkTokenSchema });

/** GET /api/invitations/:token (public): what the link is for, and whether it still works. */
export const invitationPreviewSchema = z.object({
  status: invitationStatusSchema,
  shopName: z.string(),
  role: roleSchema,
  email: z.string(),
  invitedByName: z.string().nullable(),
  expiresAt: z.string(),
  /** Whether the invited address already has a Ringdown account (then: sign in, then accept). */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** What a newcomer types to create their account from an invitation. */
export const newcomerAccountSchema = z.object({ name: personNameSchema, password: passwordSchema });
export type NewcomerAccount = z.infer<typeof newcomerAccountSchema>;

/**
 * POST /api/invitations/:token (public). Signed in as the invited address: send `{}` to join.
 * Without an account: send name and password to create one.
 */
export const acceptInvitationBodySchema = z.object({
  name: personNameSchema.optional(),
  password: passwordSchema.optional(),
});
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBodySchema>;

// --- password reset ------------------------------------------------------------------------

/** POST /api/auth/password-reset: always answered 202, whether or not the address has an account. */
export const passwordResetRequestBodySchema = z.object({ email: emailSchema });
export type PasswordResetRequestBody = z.infer<typeof passwordResetRequestBodySchema>;

export const passwordResetRequestedSchema = z.object({ message: z.string() });

/** GET /api/auth/password-reset/:token: whether the link still works. */
export const passwordResetLinkSchema = z.object({
  status: z.enum(["valid", "expired", "used"]),
  expiresAt: z.string(),
});
export type PasswordResetLink = z.infer<typeof passwordResetLinkSchema>;

/** POST /api/auth/password-reset/:token: the new password. */
export const passwordResetBodySchema = z.object({ password: passwordSchema });
export type PasswordResetBody = z.infer<typeof passwordResetBodySchema>;

// --- captured development mail -------------------------------------------------------------

export const capturedMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  hasHtml: z.boolean(),
  /** Every http(s) link in the message, in order of appearance. */
  links: z.array(z.string()),
});
export type CapturedMail = z.infer<typeof capturedMailSchema>;

/** GET /api/dev/mail (development only): newest first. */
export const capturedMailListSchema = z.object({ items: z.array(capturedMailSchema), directory: z.string() });
export type CapturedMailList = z.infer<typeof capturedMailListSchema>;
