import { recipeSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

/** Takes a recipe out of the shop's bin, with its history and cut log. */
export function restoreDeletedRecipe(shopId: string, recipeId: string) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/restore-deleted`), { method: "POST", schema: recipeSchema });
}

export function useRestoreDeletedRecipe(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (recipeId: string) => restoreDeletedRecipe(shopId, recipeId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) }),
  });
}
