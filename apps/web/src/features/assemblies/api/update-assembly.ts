import { assemblySchema, type AssemblyPatchBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { assembliesKey } from "./get-assemblies";

export function updateAssembly(shopId: string, assemblyId: string, body: AssemblyPatchBody) {
  return apiRequest(shopApiPath(shopId, `/assemblies/${encodeURIComponent(assemblyId)}`), { method: "PATCH", body, schema: assemblySchema });
}

export function useUpdateAssembly(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ assemblyId, body }: { assemblyId: string; body: AssemblyPatchBody }) => updateAssembly(shopId, assemblyId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assembliesKey(shopId) }),
  });
}
