import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { materialsKey } from "./get-materials";

/** Moves one of the shop's own materials to the bin; refused (409) while recipes use it. */
export function deleteMaterial(shopId: string, materialId: string) {
  return apiRequest(shopApiPath(shopId, `/materials/${encodeURIComponent(materialId)}`), { method: "DELETE" });
}

export function useDeleteMaterial(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (materialId: string) => deleteMaterial(shopId, materialId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialsKey(shopId) }),
  });
}
