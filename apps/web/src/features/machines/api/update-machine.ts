import { machineSchema, type MachinePatchBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machinesKey } from "./get-machines";

/** Fields sent replace the stored ones; `modes` replaces the machine's whole mode set. */
export function updateMachine(shopId: string, machineId: string, body: MachinePatchBody) {
  return apiRequest(shopApiPath(shopId, `/machines/${encodeURIComponent(machineId)}`), { method: "PATCH", body, schema: machineSchema });
}

export function useUpdateMachine(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ machineId, body }: { machineId: string; body: MachinePatchBody }) => updateMachine(shopId, machineId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machinesKey(shopId) }),
  });
}
