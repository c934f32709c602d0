import { isPaidRole, type Member, type MemberPage, type PaginationQuery, type Role } from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { lockShop } from "../billing/billing.repository.js";
import { assertSeatAvailable } from "../billing/billing.service.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { bumpSessionVersion } from "../users/users.repository.js";
import { countOwners, deleteMember, findMember, listMembers, setMemberRole } from "./members.repository.js";

export async function listShopMembers(shopId: string, query: PaginationQuery): Promise<MemberPage> {
  const { items, total } = await listMembers(shopId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

const LAST_OWNER_DEMOTE =
  "A shop needs at least one owner, and this is the only one. Make another member an owner first, then change this role.";
const LAST_OWNER_REMOVE =
  "A shop needs at least one owner, and this is the only one. Make another member an owner first, then remove this one.";

/**
 * Changes a member's role. The shop row is locked, so two owners demoting each other at once
 * cannot leave the shop without an owner; moving an operator to a paid role needs a free seat.
 */
export async function changeMemberRole(shopId: string, userId: string, role: Role, actor: AuditActor): Promise<Member> {
  return inTransaction(async (tx) => {
    await lockShop(shopId, tx);
    const member = await findMember(shopId, userId, tx);
    if (!member) throw AppError.notFound("No member with this id in this shop.");
    if (member.role === role) return member;
    if (member.role === "owner" && (await countOwners(shopId, tx)) <= 1) throw AppError.conflict(LAST_OWNER_DEMOTE);
    if (isPaidRole(role) && !isPaidRole(member.role)) await assertSeatAvailable(shopId, tx);
    await setMemberRole(shopId, userId, role, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "member.role_changed",
      subject: { type: "member", id: userId, label: member.name },
      detail: { from: member.role, to: role },
    });
    return { ...member, role };
  });
}

/**
 * Removes a member in one step: the membership goes and every session of that person ends at
 * once (their session version moves on). Their recipes, revisions and cut logs stay with the shop.
 */
export async function removeMember(shopId: string, userId: string, actor: AuditActor): Promise<void> {
  await inTransaction(async (tx) => {
    await lockShop(shopId, tx);
    const member = await findMember(shopId, userId, tx);
    if (!member) throw AppError.notFound("No member with this id in this shop.");
    if (member.role === "owner" && (await countOwners(shopId, tx)) <= 1) throw AppError.conflict(LAST_OWNER_REMOVE);
    await deleteMember(shopId, userId, tx);
    await bumpSessionVersion(userId, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "member.removed",
      subject: { type: "member", id: userId, label: member.name },
      detail: { role: member.role },
    });
  });
}
