import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { cuttersKey } from "./get-cutters";

/** Moves the cutter to the shop's bin; refused (409) while recipes use it. */
export function deleteCutter(shopId: string, cutterId: string) {
  return apiRequest(shopApiPath(shopId, `/cutters/${encodeURIComponent(cutterId)}`), { method: "DELETE" });
}

export function useDeleteCutter(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (cutterId: string) => deleteCutter(shopId, cutterId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cuttersKey(shopId) }),
  });
}
