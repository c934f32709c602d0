import { stiffnessMapSchema } from "@ringdown/contracts";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machineApiPath, vibrationKey } from "./keys";

/** Cells per side of the map grid (the API allows 2–101). */
export const MAP_CELLS = 25;

export function getStiffnessMap(shopId: string, machineId: string, cells: number, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, `/stiffness-map${toSearch({ cells })}`), { schema: stiffnessMapSchema, signal });
}

export const stiffnessMapQueryOptions = (shopId: string, machineId: string, cells = MAP_CELLS) =>
  queryOptions({
    queryKey: [...vibrationKey(shopId, machineId), "stiffness-map", cells] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getStiffnessMap(shopId, machineId, cells, signal),
    placeholderData: keepPreviousData,
  });

export const useStiffnessMap = (shopId: string, machineId: string, cells = MAP_CELLS) => useQuery(stiffnessMapQueryOptions(shopId, machineId, cells));
