import {
  isPaidRole,
  type AcceptInvitationBody,
  type CreateInvitationBody,
  type Invitation,
  type InvitationPreview,
  type Role,
} from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import type { SessionUser } from "../../http/locals.js";
import { hashLinkToken, newLinkToken } from "../auth/link-token.js";
import { hashPassword } from "../auth/password.js";
import { assertSeatAvailable } from "../billing/billing.service.js";
import { lockShop } from "../billing/billing.repository.js";
import type { Mailer } from "../mail/mailer.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { invitationMail } from "../mail/templates.js";
import { addMember, findMembership } from "../shops/shops.repository.js";
import { createUser, findUserIdByEmail, updateUser } from "../users/users.repository.js";
import {
  findInvitationByTokenHash,
  findOpenInvitation,
  insertInvitation,
  listOpenInvitations,
  markInvitationAccepted,
  revokeInvitation,
  type InvitationRecord,
} from "./invitations.repository.js";

/** How long an invitation link works. */
export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

const toInvitation = (r: InvitationRecord): Invitation => ({
  id: r.id,
  email: r.email,
  role: r.role,
  status: r.status,
  invitedByName: r.invitedByName,
  expiresAt: r.expiresAt.toISOString(),
  sentAt: r.sentAt.toISOString(),
});

export async function listInvitations(shopId: string): Promise<Invitation[]> {
  return (await listOpenInvitations(shopId)).map(toInvitation);
}

/**
 * Invites `email` to the shop with `role`, or re-sends: an open invitation for the same address
 * is withdrawn and replaced (its old link stops working). A paid role needs a free paid seat.
 * The e-mail is sent before the transaction commits: if it cannot be sent, nothing is saved and
 * the old link (if any) still works.
 */
export async function invite(
  shopId: string,
  inviter: { id: string; name: string; ip: string | null },
  body: CreateInvitationBody,
  deps: { config: AppConfig; mailer: Mailer },
): Promise<Invitation> {
  return inTransaction(async (tx) => {
    if (!(await lockShop(shopId, tx))) throw AppError.notFound("Shop not found.");
    const existingUser = await findUserIdByEmail(body.email, tx);
    if (existingUser && (await findMembership(shopId, existingUser, tx))) {
      const message = "This person is already a member of the shop. Change their role in the members list instead.";
      throw AppError.conflict(message, { email: message });
    }
    const previous = await findOpenInvitation(shopId, { email: body.email }, tx);
    if (previous) await revokeInvitation(shopId, previous.id, tx);
    // Counted after the replaced invitation was withdrawn: re-sending never needs a second seat.
    if (isPaidRole(body.role)) await assertSeatAvailable(shopId, tx);
    const { token, hash } = newLinkToken();
    const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
    const id = await insertInvitation({ shopId, email: body.email, role: body.role, tokenHash: hash, invitedBy: inviter.id, expiresAt }, tx);
    const created = await findOpenInvitation(shopId, { id }, tx);
    if (!created) throw new Error("invitation vanished inside its own transaction");
    await recordAuditEvent(tx, {
      shopId,
      actor: { userId: inviter.id, name: inviter.name, ip: inviter.ip },
      action: "invitation.sent",
      subject: { type: "invitation", id, label: body.email },
      detail: { role: body.role, replacedInvitationId: previous?.id },
    });
    await deps.mailer.send(
      invitationMail({
        to: body.email,
        shopName: created.shopName,
        inviterName: inviter.name,
        role: body.role,
        url: `${deps.config.appOrigin}/invitations/${token}`,
        expiresAt,
      }),
    );
    return toInvitation(created);
  });
}

/** Sends an open invitation again with a new link and a new 7 days. */
export async function resendInvitation(
  shopId: string,
  invitationId: string,
  inviter: { id: string; name: string; ip: string | null },
  deps: { config: AppConfig; mailer: Mailer },
): Promise<Invitation> {
  const open = await findOpenInvitation(shopId, { id: invitationId });
  if (!open) throw AppError.notFound("No open invitation with this id in this shop.");
  return invite(shopId, inviter, { email: open.email, role: open.role }, deps);
}

export async function withdrawInvitation(shopId: string, invitationId: string, actor: AuditActor): Promise<void> {
  await inTransaction(async (tx) => {
    const open = await findOpenInvitation(shopId, { id: invitationId }, tx);
    if (!open || !(await revokeInvitation(shopId, invitationId, tx))) throw AppError.notFound("No open invitation with this id in this shop.");
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "invitation.revoked",
      subject: { type: "invitation", id: invitationId, label: open.email },
      detail: { role: open.role },
    });
  });
}

export async function previewInvitation(token: string): Promise<InvitationPreview> {
  const found = await findInvitationByTokenHash(hashLinkToken(token));
  if (!found) throw AppError.notFound("This invitation link is not valid. Check that it was copied completely.");
  return {
    status: found.status,
    shopName: found.shopName,
    role: found.role,
    email: found.email,
    invitedByName: found.invitedByName,
    expiresAt: found.expiresAt.toISOString(),
    accountExists: (await findUserIdByEmail(found.email)) !== null,
  };
}

const closedMessages = {
  expired: "This invitation has expired. Ask the shop's owner to send a new one.",
  accepted: "This invitation has already been used. Sign in to reach the shop.",
  revoked: "This invitation was withdrawn or replaced by a newer one. Use the latest invitation e-mail, or ask the shop's owner.",
} as const;

export interface Acceptance {
  userId: string;
  sessionVersion: number;
  shopId: string;
  role: Role;
  /** True when a new account was created (the caller signs it in). */
  created: boolean;
}

function assertInvitationOpen(invitation: InvitationRecord | null): InvitationRecord {
  if (!invitation) throw AppError.notFound("This invitation link is not valid. Check that it was copied completely.");
  if (invitation.status !== "pending") throw AppError.conflict(closedMessages[invitation.status]);
  return invitation;
}

/**
 * Uses an invitation once: a signed-in person with the invited address joins the shop; someone
 * without an account creates one (name and password) and joins. The invitation row is locked, so
 * two tabs accepting at once cannot both succeed.
 */
export async function acceptInvitation(token: string, body: AcceptInvitationBody, signedIn: SessionUser | null, ip: string | null = null): Promise<Acceptance> {
  const tokenHash = hashLinkToken(token);
  // A link that cannot be accepted is refused before the password hash (bcrypt takes a few hundred
  // milliseconds on purpose, outside the transaction); the check is repeated under the row lock.
  assertInvitationOpen(await findInvitationByTokenHash(tokenHash));
  const passwordHash = !signedIn && body.password ? await hashPassword(body.password) : null;
  return inTransaction(async (tx) => {
    const invitation = assertInvitationOpen(await findInvitationByTokenHash(tokenHash, tx));
    await lockShop(invitation.shopId, tx);

    let userId: string;
    let userName: string;
    let sessionVersion: number;
    let created = false;
    if (signedIn) {
      if (signedIn.email !== invitation.email) {
        throw AppError.conflict(
          `This invitation is for ${invitation.email}, but you are signed in as ${signedIn.email}. Sign out, then open the link again.`,
        );
      }
      userId = signedIn.id;
      userName = signedIn.name;
      sessionVersion = signedIn.sessionVersion;
    } else {
      if (await findUserIdByEmail(invitation.email, tx)) {
        throw AppError.conflict(`An account for ${invitation.email} already exists. Sign in, then open the invitation link again to join.`);
      }
      const fields: Record<string, string> = {};
      if (!body.name) fields.name = "Enter your name";
      if (!body.password || !passwordHash) fields.password = "Choose a password of at least 10 characters";
      if (Object.keys(fields).length > 0) throw AppError.validation("Some fields need attention.", fields);
      const user = await createUser({ email: invitation.email, name: body.name!, passwordHash: passwordHash! }, tx);
      userId = user.id;
      userName = user.name;
      sessionVersion = user.sessionVersion;
      created = true;
    }

    const membership = await findMembership(invitation.shopId, userId, tx);
    if (!membership) {
      // This invitation's own seat is already counted among the used ones.
      if (isPaidRole(invitation.role)) await assertSeatAvailable(invitation.shopId, tx, 1);
      await addMember({ shopId: invitation.shopId, userId, role: invitation.role }, tx);
    }
    await markInvitationAccepted(invitation.id, userId, tx);
    await recordAuditEvent(tx, {
      shopId: invitation.shopId,
      actor: { userId, name: userName, ip },
      action: "invitation.accepted",
      subject: { type: "invitation", id: invitation.id, label: invitation.email },
      detail: { role: membership?.role ?? invitation.role, newAccount: created, alreadyMember: membership !== null },
    });
    await updateUser(userId, { activeShopId: invitation.shopId }, tx);
    return { userId, sessionVersion, shopId: invitation.shopId, role: membership?.role ?? invitation.role, created };
  });
}
