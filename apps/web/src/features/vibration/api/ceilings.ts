import { ceilingsMutationSchema, ceilingsSchema, type CeilingsBody } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { invalidateAfterProfileChange, machineApiPath, vibrationKey } from "./keys";

/** GET and PUT …/ceilings. */
export function getCeilings(shopId: string, machineId: string, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, "/ceilings"), { schema: ceilingsSchema, signal });
}

export const ceilingsQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: [...vibrationKey(shopId, machineId), "ceilings"] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getCeilings(shopId, machineId, signal),
  });

export const useCeilings = (shopId: string, machineId: string) => useQuery(ceilingsQueryOptions(shopId, machineId));

export function putCeilings(shopId: string, machineId: string, body: CeilingsBody) {
  return apiRequest(machineApiPath(shopId, machineId, "/ceilings"), { method: "PUT", body, schema: ceilingsMutationSchema });
}

export function usePutCeilings(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CeilingsBody) => putCeilings(shopId, machineId, body),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}
