import { recipeSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

/** Restores an earlier revision as a new one (history is never rewritten). */
export function restoreRevision(shopId: string, recipeId: string, revision: number, changeNote: string) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/restore`), {
    method: "POST",
    body: { revision, changeNote },
    schema: recipeSchema,
  });
}

export function useRestoreRevision(shopId: string, recipeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ revision, changeNote }: { revision: number; changeNote: string }) => restoreRevision(shopId, recipeId, revision, changeNote),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) }),
  });
}
