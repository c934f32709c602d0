import { assemblySchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { assembliesKey } from "./get-assemblies";

export function restoreAssembly(shopId: string, assemblyId: string) {
  return apiRequest(shopApiPath(shopId, `/assemblies/${encodeURIComponent(assemblyId)}/restore`), { method: "POST", schema: assemblySchema });
}

export function useRestoreAssembly(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (assemblyId: string) => restoreAssembly(shopId, assemblyId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assembliesKey(shopId) }),
  });
}
