import { materialSchema, type MaterialBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { materialsKey } from "./get-materials";

export function createMaterial(shopId: string, body: MaterialBody) {
  return apiRequest(shopApiPath(shopId, "/materials"), { method: "POST", body, schema: materialSchema });
}

export function useCreateMaterial(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MaterialBody) => createMaterial(shopId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialsKey(shopId) }),
  });
}
