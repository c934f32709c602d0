import { materialSchema, type MaterialPatchBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { materialsKey } from "./get-materials";

export function updateMaterial(shopId: string, materialId: string, body: MaterialPatchBody) {
  return apiRequest(shopApiPath(shopId, `/materials/${encodeURIComponent(materialId)}`), { method: "PATCH", body, schema: materialSchema });
}

export function useUpdateMaterial(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ materialId, body }: { materialId: string; body: MaterialPatchBody }) => updateMaterial(shopId, materialId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialsKey(shopId) }),
  });
}
