import { auditEventPageSchema, type AuditEventListQuery } from "@ringdown/contracts";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's change history starts with this key. */
export function auditEventsKey(shopId: string) {
  return ["shops", shopId, "audit-events"] as const;
}

export type AuditEventListParams = Partial<AuditEventListQuery>;

export function getAuditEvents(shopId: string, params: AuditEventListParams, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/audit-events${toSearch({ ...params })}`), { schema: auditEventPageSchema, signal });
}

export const auditEventsQueryOptions = (shopId: string, params: AuditEventListParams) =>
  queryOptions({
    queryKey: [...auditEventsKey(shopId), "list", params] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getAuditEvents(shopId, params, signal),
    // The history grows while it is open elsewhere: look again whenever the page is shown.
    staleTime: 0,
    // While the next page or filter loads, the table keeps the rows it has.
    placeholderData: keepPreviousData,
  });

export function useAuditEvents(shopId: string, params: AuditEventListParams) {
  return useQuery(auditEventsQueryOptions(shopId, params));
}
