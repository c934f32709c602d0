import { cutterSchema, type CutterStatus } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { cuttersKey } from "./get-cutters";

/** Moves a cutter along proposed → approved → retired (or back: reinstate). */
export function transitionCutter(shopId: string, cutterId: string, to: CutterStatus) {
  return apiRequest(shopApiPath(shopId, `/cutters/${encodeURIComponent(cutterId)}/transition`), {
    method: "POST",
    body: { to },
    schema: cutterSchema,
  });
}

export function useTransitionCutter(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ cutterId, to }: { cutterId: string; to: CutterStatus }) => transitionCutter(shopId, cutterId, to),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cuttersKey(shopId) }),
  });
}
