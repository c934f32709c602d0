import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipeRoot, recipesRoot } from "./keys";

/** Moves a recipe to the shop's bin (it can be restored from there). */
export function deleteRecipe(shopId: string, recipeId: string) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}`), { method: "DELETE" });
}

export function useDeleteRecipe(shopId: string, recipeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteRecipe(shopId, recipeId),
    onSuccess: () => {
      // The recipe's own queries would now answer 404: drop them instead of refetching them, so the
      // page being left does not turn into "not found" (and unmount) before it can move on.
      queryClient.removeQueries({ queryKey: recipeRoot(shopId, recipeId) });
      return queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) });
    },
  });
}
