import { cutterSchema, type CutterPatchBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { cuttersKey } from "./get-cutters";

export function updateCutter(shopId: string, cutterId: string, body: CutterPatchBody) {
  return apiRequest(shopApiPath(shopId, `/cutters/${encodeURIComponent(cutterId)}`), { method: "PATCH", body, schema: cutterSchema });
}

export function useUpdateCutter(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ cutterId, body }: { cutterId: string; body: CutterPatchBody }) => updateCutter(shopId, cutterId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cuttersKey(shopId) }),
  });
}
