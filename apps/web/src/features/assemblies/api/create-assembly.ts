import { assemblySchema, type AssemblyBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { assembliesKey } from "./get-assemblies";

export function createAssembly(shopId: string, body: AssemblyBody) {
  return apiRequest(shopApiPath(shopId, "/assemblies"), { method: "POST", body, schema: assemblySchema });
}

export function useCreateAssembly(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AssemblyBody) => createAssembly(shopId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assembliesKey(shopId) }),
  });
}
