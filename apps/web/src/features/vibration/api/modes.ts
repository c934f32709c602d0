import { machineModeListSchema, modeMutationSchema, type ModeBody, type ModePatchBody } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { invalidateAfterProfileChange, machineApiPath, vibrationKey } from "./keys";

/** GET, POST, PATCH and DELETE …/modes. */
export function getModes(shopId: string, machineId: string, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, "/modes"), { schema: machineModeListSchema, signal });
}

export const modesQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: [...vibrationKey(shopId, machineId), "modes"] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getModes(shopId, machineId, signal),
  });

export const useModes = (shopId: string, machineId: string) => useQuery(modesQueryOptions(shopId, machineId));

export function createMode(shopId: string, machineId: string, body: ModeBody) {
  return apiRequest(machineApiPath(shopId, machineId, "/modes"), { method: "POST", body, schema: modeMutationSchema });
}

export function updateMode(shopId: string, machineId: string, modeId: string, body: ModePatchBody) {
  return apiRequest(machineApiPath(shopId, machineId, `/modes/${encodeURIComponent(modeId)}`), { method: "PATCH", body, schema: modeMutationSchema });
}

export function deleteMode(shopId: string, machineId: string, modeId: string) {
  return apiRequest(machineApiPath(shopId, machineId, `/modes/${encodeURIComponent(modeId)}`), { method: "DELETE", schema: modeMutationSchema });
}

export function useCreateMode(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ModeBody) => createMode(shopId, machineId, body),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}

export function useUpdateMode(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ modeId, body }: { modeId: string; body: ModePatchBody }) => updateMode(shopId, machineId, modeId, body),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}

export function useDeleteMode(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (modeId: string) => deleteMode(shopId, machineId, modeId),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}
