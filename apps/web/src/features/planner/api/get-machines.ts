import { machinePageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** The largest page the API serves; a shop's machines fit in one. */
const ALL = 200;

export function getMachines(shopId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/machines${toSearch({ pageSize: ALL })}`), { schema: machinePageSchema, signal });
}

export const machinesQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "machines", "all"],
    queryFn: ({ signal }) => getMachines(shopId, signal),
  });

export const useMachines = (shopId: string) => useQuery(machinesQueryOptions(shopId));
