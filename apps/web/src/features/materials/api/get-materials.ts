import { materialPageSchema, type MaterialListQuery } from "@ringdown/contracts";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's materials starts with this key; mutations invalidate it. */
export function materialsKey(shopId: string) {
  return ["shops", shopId, "materials"] as const;
}

export type MaterialListParams = Partial<MaterialListQuery>;

/** The list fits one page (the reference rows plus a shop's own); the table sorts it in the browser. */
export const MATERIALS_PAGE_SIZE = 200;

export function getMaterials(shopId: string, params: MaterialListParams, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/materials${toSearch({ pageSize: MATERIALS_PAGE_SIZE, ...params })}`), {
    schema: materialPageSchema,
    signal,
  });
}

export const materialsQueryOptions = (shopId: string, params: MaterialListParams) =>
  queryOptions({
    queryKey: [...materialsKey(shopId), "list", params] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getMaterials(shopId, params, signal),
    placeholderData: keepPreviousData,
  });

export function useMaterials(shopId: string, params: MaterialListParams) {
  return useQuery(materialsQueryOptions(shopId, params));
}
