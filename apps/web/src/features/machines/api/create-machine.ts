import { machineSchema, type MachineBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { machinesKey } from "./get-machines";

export function createMachine(shopId: string, body: MachineBody) {
  return apiRequest(shopApiPath(shopId, "/machines"), { method: "POST", body, schema: machineSchema });
}

export function useCreateMachine(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MachineBody) => createMachine(shopId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machinesKey(shopId) }),
  });
}
