import type { Role } from "@ringdown/contracts";
import { literal } from "sequelize";
import { MembershipModel } from "../shops/membership.model.js";
import { UserModel } from "../users/user.model.js";

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
