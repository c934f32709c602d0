import { backlashReadingListSchema, backlashReadingMutationSchema, type BacklashReadingBody } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { invalidateAfterProfileChange, machineApiPath, vibrationKey } from "./keys";

/** GET, POST and DELETE …/backlash-readings. */
export function getBacklashReadings(shopId: string, machineId: string, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, "/backlash-readings"), { schema: backlashReadingListSchema, signal });
}

export const backlashReadingsQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: [...vibrationKey(shopId, machineId), "backlash-readings"] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getBacklashReadings(shopId, machineId, signal),
  });

export const useBacklashReadings = (shopId: string, machineId: string) => useQuery(backlashReadingsQueryOptions(shopId, machineId));

export function createBacklashReading(shopId: string, machineId: string, body: BacklashReadingBody) {
  return apiRequest(machineApiPath(shopId, machineId, "/backlash-readings"), { method: "POST", body, schema: backlashReadingMutationSchema });
}

export function deleteBacklashReading(shopId: string, machineId: string, readingId: string) {
  return apiRequest(machineApiPath(shopId, machineId, `/backlash-readings/${encodeURIComponent(readingId)}`), {
    method: "DELETE",
    schema: backlashReadingMutationSchema,
  });
}

export function useCreateBacklashReading(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: BacklashReadingBody) => createBacklashReading(shopId, machineId, body),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}

export function useDeleteBacklashReading(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (readingId: string) => deleteBacklashReading(shopId, machineId, readingId),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}
