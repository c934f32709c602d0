import { assemblyPageSchema, type AssemblyListQuery } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's assemblies starts with this key; mutations invalidate it. */
export function assembliesKey(shopId: string) {
  return ["shops", shopId, "assemblies"] as const;
}

export type AssemblyListParams = Partial<AssemblyListQuery>;

export function getAssemblies(shopId: string, params: AssemblyListParams, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/assemblies${toSearch({ pageSize: 200, ...params })}`), { schema: assemblyPageSchema, signal });
}

export const assembliesQueryOptions = (shopId: string, params: AssemblyListParams) =>
  queryOptions({
    queryKey: [...assembliesKey(shopId), "list", params] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getAssemblies(shopId, params, signal),
  });

export function useAssemblies(shopId: string, params: AssemblyListParams) {
  return useQuery(assembliesQueryOptions(shopId, params));
}
