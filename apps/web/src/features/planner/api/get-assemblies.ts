import { assemblyPageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

const ALL = 200;

/** Cutter assemblies of one machine, or of every machine when machineId is null. */
export function getAssemblies(shopId: string, machineId: string | null, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/assemblies${toSearch({ machineId, pageSize: ALL })}`), { schema: assemblyPageSchema, signal });
}

export const assembliesQueryOptions = (shopId: string, machineId: string | null) =>
  queryOptions({
    queryKey: ["shops", shopId, "assemblies", "all", { machineId }],
    queryFn: ({ signal }) => getAssemblies(shopId, machineId, signal),
  });

export const useAssemblies = (shopId: string, machineId: string | null, enabled = true) =>
  useQuery({ ...assembliesQueryOptions(shopId, machineId), enabled });
