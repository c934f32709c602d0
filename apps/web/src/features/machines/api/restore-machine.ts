import { machineSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machinesKey } from "./get-machines";

export function restoreMachine(shopId: string, machineId: string) {
  return apiRequest(shopApiPath(shopId, `/machines/${encodeURIComponent(machineId)}/restore`), { method: "POST", schema: machineSchema });
}

export function useRestoreMachine(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (machineId: string) => restoreMachine(shopId, machineId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machinesKey(shopId) }),
  });
}
