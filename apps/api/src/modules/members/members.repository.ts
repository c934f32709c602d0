import type { Role } from "@ringdown/contracts";
import { literal } from "sequelize";
import { MembershipModel } from "../shops/membership.model.js";
import { UserModel } from "../users/user.model.js";
import type { Tx } from "../../db/sequelize.js";

export interface MemberRecord {
  userId: string;
  name: string;
  email: string;
  role: Role;
}

// Owners first, then tooling managers, programmers, operators; by name within a role.
const roleOrder = literal(
  `CASE "MembershipModel"."role" WHEN 'owner' THEN 0 WHEN 'tooling_manager' THEN 1 WHEN 'programmer' THEN 2 ELSE 3 END`,
);

/** One page of the members of `shopId` (always filtered by the shop). */
export async function listMembers(
  shopId: string,
  page: { page: number; pageSize: number },
): Promise<{ items: MemberRecord[]; total: number }> {
  const { rows, count } = await MembershipModel.findAndCountAll({
    where: { shopId },
    include: [{ model: UserModel, as: "user", attributes: ["id", "name", "email"], required: true }],
    order: [roleOrder, [{ model: UserModel, as: "user" }, "name", "ASC"], ["userId", "ASC"]],
    limit: page.pageSize,
    offset: (page.page - 1) * page.pageSize,
  });
  return {
    total: count,
    items: rows.map((row) => {
      if (!row.user) throw new Error("membership loaded without its user");
      return { userId: row.userId, name: row.user.name, email: row.user.email, role: row.role };
    }),
  };
}

/** One member of the shop, or null. */
export async function findMember(shopId: string, userId: string, tx?: Tx): Promise<MemberRecord | null> {
  const row = await MembershipModel.findOne({
    where: { shopId, userId },
    include: [{ model: UserModel, as: "user", attributes: ["id", "name", "email"], required: true }],
    transaction: tx ?? null,
  });
  if (!row?.user) return null;
  return { userId: row.userId, name: row.user.name, email: row.user.email, role: row.role };
}

export async function countOwners(shopId: string, tx?: Tx): Promise<number> {
  return MembershipModel.count({ where: { shopId, role: "owner" }, transaction: tx ?? null });
}

export async function setMemberRole(shopId: string, userId: string, role: Role, tx?: Tx): Promise<void> {
  await MembershipModel.update({ role }, { where: { shopId, userId }, transaction: tx ?? null });
}

/** Removes the membership only: the person's account, recipes and logs stay. */
export async function deleteMember(shopId: string, userId: string, tx?: Tx): Promise<void> {
  await MembershipModel.destroy({ where: { shopId, userId }, transaction: tx ?? null });
}
