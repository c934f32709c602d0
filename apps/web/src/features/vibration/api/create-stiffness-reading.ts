import { stiffnessReadingMutationSchema, type StiffnessReadingBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { invalidateAfterProfileChange, machineApiPath } from "./keys";

export function createStiffnessReading(shopId: string, machineId: string, body: StiffnessReadingBody) {
  return apiRequest(machineApiPath(shopId, machineId, "/stiffness-readings"), { method: "POST", body, schema: stiffnessReadingMutationSchema });
}

export function useCreateStiffnessReading(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: StiffnessReadingBody) => createStiffnessReading(shopId, machineId, body),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}
