import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machinesKey } from "./get-machines";

/** Moves a machine to the bin; refused (409) while assemblies or recipes are on it. */
export function deleteMachine(shopId: string, machineId: string) {
  return apiRequest(shopApiPath(shopId, `/machines/${encodeURIComponent(machineId)}`), { method: "DELETE" });
}

export function useDeleteMachine(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (machineId: string) => deleteMachine(shopId, machineId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machinesKey(shopId) }),
  });
}
