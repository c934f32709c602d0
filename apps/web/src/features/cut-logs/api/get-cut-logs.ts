import { cutLogPageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Cuts logged on one machine in one material, across every recipe (newest first). */
export function getCutLogs(shopId: string, machineId: string, materialId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/cut-logs${toSearch({ machineId, materialId, pageSize: 50 })}`), { schema: cutLogPageSchema, signal });
}

export const cutLogsQueryOptions = (shopId: string, machineId: string, materialId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "cut-logs", { machineId, materialId }],
    queryFn: ({ signal }) => getCutLogs(shopId, machineId, materialId, signal),
  });

export const useCutLogs = (shopId: string, machineId: string | null, materialId: string | null) =>
  useQuery({ ...cutLogsQueryOptions(shopId, machineId ?? "", materialId ?? ""), enabled: machineId !== null && materialId !== null });
