import { materialPageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

const ALL = 200;

/** The global library and the shop's own materials. */
export function getMaterials(shopId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/materials${toSearch({ pageSize: ALL })}`), { schema: materialPageSchema, signal });
}

export const materialsQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "materials", "all"],
    queryFn: ({ signal }) => getMaterials(shopId, signal),
  });

export const useMaterials = (shopId: string) => useQuery(materialsQueryOptions(shopId));
