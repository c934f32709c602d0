import { machineSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machinesKey } from "./get-machines";

export function getMachine(shopId: string, machineId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/machines/${encodeURIComponent(machineId)}`), { schema: machineSchema, signal });
}

export const machineQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: [...machinesKey(shopId), "detail", machineId] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getMachine(shopId, machineId, signal),
  });

export function useMachine(shopId: string, machineId: string) {
  return useQuery(machineQueryOptions(shopId, machineId));
}
