import type { MemberPage, PaginationQuery } from "@ringdown/contracts";
import { listMembers } from "./members.repository.js";

export async function listShopMembers(shopId: string, query: PaginationQuery): Promise<MemberPage> {
  const { items, total } = await listMembers(shopId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}
