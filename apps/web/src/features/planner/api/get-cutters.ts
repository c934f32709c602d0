import { cutterPageSchema, cutterSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

const ALL = 200;

export function getCutters(shopId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/cutters${toSearch({ pageSize: ALL })}`), { schema: cutterPageSchema, signal });
}

export const cuttersQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "cutters", "all"],
    queryFn: ({ signal }) => getCutters(shopId, signal),
  });

export const useCutters = (shopId: string) => useQuery(cuttersQueryOptions(shopId));

export function getCutter(shopId: string, cutterId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/cutters/${encodeURIComponent(cutterId)}`), { schema: cutterSchema, signal });
}

export const cutterQueryOptions = (shopId: string, cutterId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "cutters", "one", cutterId],
    queryFn: ({ signal }) => getCutter(shopId, cutterId, signal),
  });

export const useCutter = (shopId: string, cutterId: string | null) =>
  useQuery({ ...cutterQueryOptions(shopId, cutterId ?? ""), enabled: cutterId !== null });
