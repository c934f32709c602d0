import { stiffnessReadingMutationSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { invalidateAfterProfileChange, machineApiPath } from "./keys";

export function deleteStiffnessReading(shopId: string, machineId: string, readingId: string) {
  return apiRequest(machineApiPath(shopId, machineId, `/stiffness-readings/${encodeURIComponent(readingId)}`), {
    method: "DELETE",
    schema: stiffnessReadingMutationSchema,
  });
}

export function useDeleteStiffnessReading(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (readingId: string) => deleteStiffnessReading(shopId, machineId, readingId),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}
