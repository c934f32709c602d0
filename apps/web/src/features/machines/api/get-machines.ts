import { machinePageSchema, type MachineListQuery } from "@ringdown/contracts";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's machines starts with this key; mutations invalidate it. */
export function machinesKey(shopId: string) {
  return ["shops", shopId, "machines"] as const;
}

export type MachineListParams = Partial<MachineListQuery>;

/** A shop's machines fit on one page; the table sorts them in the browser. */
export const MACHINES_PAGE_SIZE = 200;

export function getMachines(shopId: string, params: MachineListParams, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/machines${toSearch({ pageSize: MACHINES_PAGE_SIZE, ...params })}`), {
    schema: machinePageSchema,
    signal,
  });
}

export const machinesQueryOptions = (shopId: string, params: MachineListParams) =>
  queryOptions({
    queryKey: [...machinesKey(shopId), "list", params] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getMachines(shopId, params, signal),
    placeholderData: keepPreviousData,
  });

export function useMachines(shopId: string, params: MachineListParams) {
  return useQuery(machinesQueryOptions(shopId, params));
}
