import { recipeSchema } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

/** Copies a recipe onto another assembly (usually another machine): recomputed there, starting as a draft. */
export function copyRecipe(shopId: string, recipeId: string, body: { assemblyId: string; name?: string }) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/copy`), { method: "POST", body, schema: recipeSchema });
}

export function useCopyRecipe(shopId: string, recipeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { assemblyId: string; name?: string }) => copyRecipe(shopId, recipeId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) }),
  });
}
