import { recipeSchema, type RecipeBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Saves a planned cut as a draft recipe; the server recomputes every number before storing it. */
export function createRecipe(shopId: string, body: RecipeBody) {
  return apiRequest(shopApiPath(shopId, "/recipes"), { method: "POST", body, schema: recipeSchema });
}

export function useCreateRecipe(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RecipeBody) => createRecipe(shopId, body),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: ["shops", shopId, "recipes"] });
    },
  });
}
