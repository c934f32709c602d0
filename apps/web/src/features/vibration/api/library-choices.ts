import { assemblyPageSchema, cutLogPageSchema, cutterSchema, materialPageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** What the stability chart of a machine needs from the rest of the library. */
const ALL = 200;

export const machineAssembliesQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "assemblies", "all", { machineId }],
    enabled: shopId !== "",
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, `/assemblies${toSearch({ machineId, pageSize: ALL })}`), { schema: assemblyPageSchema, signal }),
  });
export const useMachineAssemblies = (shopId: string, machineId: string) => useQuery(machineAssembliesQueryOptions(shopId, machineId));

export const materialsQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "materials", "all"],
    enabled: shopId !== "",
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, `/materials${toSearch({ pageSize: ALL })}`), { schema: materialPageSchema, signal }),
  });
export const useMaterialChoices = (shopId: string) => useQuery(materialsQueryOptions(shopId));

export const cutterQueryOptions = (shopId: string, cutterId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "cutters", "one", cutterId],
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, `/cutters/${encodeURIComponent(cutterId)}`), { schema: cutterSchema, signal }),
  });
export const useCutterOf = (shopId: string, cutterId: string | null) =>
  useQuery({ ...cutterQueryOptions(shopId, cutterId ?? ""), enabled: cutterId !== null && shopId !== "" });

/** Cuts logged on one machine in one material (newest first, the latest 50). */
export const machineCutLogsQueryOptions = (shopId: string, machineId: string, materialId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "cut-logs", { machineId, materialId }],
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, `/cut-logs${toSearch({ machineId, materialId, pageSize: 50 })}`), { schema: cutLogPageSchema, signal }),
  });
export const useMachineCutLogs = (shopId: string, machineId: string, materialId: string | null) =>
  useQuery({ ...machineCutLogsQueryOptions(shopId, machineId, materialId ?? ""), enabled: materialId !== null && shopId !== "" });
