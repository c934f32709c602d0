import { materialSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { materialsKey } from "./get-materials";

export function restoreMaterial(shopId: string, materialId: string) {
  return apiRequest(shopApiPath(shopId, `/materials/${encodeURIComponent(materialId)}/restore`), { method: "POST", schema: materialSchema });
}

export function useRestoreMaterial(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (materialId: string) => restoreMaterial(shopId, materialId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialsKey(shopId) }),
  });
}
