import { recipePageSchema, type RecipeListQuery } from "@ringdown/contracts";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

/** What the list asks the server for (filters, sort and page; the server does the work); `deleted` lists the bin. */
export type RecipeListParams = Omit<RecipeListQuery, "deleted"> & { deleted?: boolean };

export function getRecipes(shopId: string, query: RecipeListParams, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/recipes${toSearch({ ...query })}`), { schema: recipePageSchema, signal });
}

export const recipesQueryOptions = (shopId: string, query: RecipeListParams) =>
  queryOptions({
    queryKey: [...recipesRoot(shopId), "list", query],
    queryFn: ({ signal }) => getRecipes(shopId, query, signal),
    // Keep the current page on screen while the next one loads.
    placeholderData: keepPreviousData,
  });

export const useRecipes = (shopId: string, query: RecipeListParams) => useQuery(recipesQueryOptions(shopId, query));
