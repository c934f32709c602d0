import { materialSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { materialsKey } from "./get-materials";

/** Copies a reference (or own) material into the shop, where it can be adjusted. */
export function copyMaterial(shopId: string, materialId: string) {
  return apiRequest(shopApiPath(shopId, `/materials/${encodeURIComponent(materialId)}/copy`), { method: "POST", body: {}, schema: materialSchema });
}

export function useCopyMaterial(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (materialId: string) => copyMaterial(shopId, materialId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialsKey(shopId) }),
  });
}
