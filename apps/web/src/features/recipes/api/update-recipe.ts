import { recipeSchema, type RecipeUpdateBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

/** Edits a recipe: the server recomputes it and stores the change as a new revision. */
export function updateRecipe(shopId: string, recipeId: string, body: RecipeUpdateBody) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}`), { method: "PATCH", body, schema: recipeSchema });
}

export function useUpdateRecipe(shopId: string, recipeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RecipeUpdateBody) => updateRecipe(shopId, recipeId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) }),
  });
}
