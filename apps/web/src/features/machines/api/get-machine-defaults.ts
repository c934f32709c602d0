import { machineDefaultsSchema, type MachineKind } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machinesKey } from "./get-machines";

/** Starting values for a new machine of a kind; every defaulted field is named in `estimatedFields`. */
export function getMachineDefaults(shopId: string, kind: MachineKind, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/machines/defaults?kind=${encodeURIComponent(kind)}`), { schema: machineDefaultsSchema, signal });
}

export const machineDefaultsQueryOptions = (shopId: string, kind: MachineKind) =>
  queryOptions({
    queryKey: [...machinesKey(shopId), "defaults", kind] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getMachineDefaults(shopId, kind, signal),
    staleTime: Infinity,
  });

export function useMachineDefaults(shopId: string, kind: MachineKind) {
  return useQuery(machineDefaultsQueryOptions(shopId, kind));
}
