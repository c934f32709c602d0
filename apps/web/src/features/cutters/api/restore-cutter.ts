import { cutterSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { cuttersKey } from "./get-cutters";

/** Takes a deleted cutter back out of the shop's bin. */
export function restoreCutter(shopId: string, cutterId: string) {
  return apiRequest(shopApiPath(shopId, `/cutters/${encodeURIComponent(cutterId)}/restore`), { method: "POST", schema: cutterSchema });
}

export function useRestoreCutter(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (cutterId: string) => restoreCutter(shopId, cutterId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cuttersKey(shopId) }),
  });
}
