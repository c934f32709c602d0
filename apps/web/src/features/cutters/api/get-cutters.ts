import { cutterPageSchema, type CutterListQuery } from "@ringdown/contracts";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's cutters starts with this key; mutations invalidate it. */
export function cuttersKey(shopId: string) {
  return ["shops", shopId, "cutters"] as const;
}

export type CutterListParams = Partial<CutterListQuery>;

export function getCutters(shopId: string, params: CutterListParams, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/cutters${toSearch({ ...params })}`), { schema: cutterPageSchema, signal });
}

export const cuttersQueryOptions = (shopId: string, params: CutterListParams) =>
  queryOptions({
    queryKey: [...cuttersKey(shopId), "list", params] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getCutters(shopId, params, signal),
    // While the next page or filter loads, the table keeps the rows it has.
    placeholderData: keepPreviousData,
  });

export function useCutters(shopId: string, params: CutterListParams) {
  return useQuery(cuttersQueryOptions(shopId, params));
}
