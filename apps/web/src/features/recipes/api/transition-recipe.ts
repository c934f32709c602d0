import { recipeSchema, type RecipeStatus } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

/** Moves a recipe along its life (trial, proven, approved, back to trial, retired…). */
export function transitionRecipe(shopId: string, recipeId: string, to: RecipeStatus, comment: string) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/transition`), {
    method: "POST",
    body: { to, comment },
    schema: recipeSchema,
  });
}

export function useTransitionRecipe(shopId: string, recipeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ to, comment }: { to: RecipeStatus; comment: string }) => transitionRecipe(shopId, recipeId, to, comment),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) }),
  });
}
