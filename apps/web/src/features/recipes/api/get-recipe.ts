import { recipeSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipeRoot } from "./keys";

export function getRecipe(shopId: string, recipeId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}`), { schema: recipeSchema, signal });
}

export const recipeQueryOptions = (shopId: string, recipeId: string) =>
  queryOptions({
    queryKey: [...recipeRoot(shopId, recipeId), "record"],
    queryFn: ({ signal }) => getRecipe(shopId, recipeId, signal),
  });

export const useRecipe = (shopId: string, recipeId: string) => useQuery(recipeQueryOptions(shopId, recipeId));
