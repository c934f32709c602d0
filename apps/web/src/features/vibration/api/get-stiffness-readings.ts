import { stiffnessReadingListSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { machineApiPath, vibrationKey } from "./keys";

export function getStiffnessReadings(shopId: string, machineId: string, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, "/stiffness-readings"), { schema: stiffnessReadingListSchema, signal });
}

export const stiffnessReadingsQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: [...vibrationKey(shopId, machineId), "stiffness-readings"] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getStiffnessReadings(shopId, machineId, signal),
  });

export const useStiffnessReadings = (shopId: string, machineId: string) => useQuery(stiffnessReadingsQueryOptions(shopId, machineId));
