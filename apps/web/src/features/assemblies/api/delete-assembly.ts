import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { assembliesKey } from "./get-assemblies";

/** Moves an assembly to the bin; refused (409) while recipes use it. */
export function deleteAssembly(shopId: string, assemblyId: string) {
  return apiRequest(shopApiPath(shopId, `/assemblies/${encodeURIComponent(assemblyId)}`), { method: "DELETE" });
}

export function useDeleteAssembly(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (assemblyId: string) => deleteAssembly(shopId, assemblyId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assembliesKey(shopId) }),
  });
}
