import { assemblySchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** One cutter assembly (holder, stick-out, runout) with its machine and cutter names. */
export function getAssembly(shopId: string, assemblyId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/assemblies/${encodeURIComponent(assemblyId)}`), { schema: assemblySchema, signal });
}

export const assemblyQueryOptions = (shopId: string, assemblyId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "assemblies", "one", assemblyId],
    queryFn: ({ signal }) => getAssembly(shopId, assemblyId, signal),
  });

export const useAssembly = (shopId: string, assemblyId: string | null) =>
  useQuery({ ...assemblyQueryOptions(shopId, assemblyId ?? ""), enabled: assemblyId !== null });
