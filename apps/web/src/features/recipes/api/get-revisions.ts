import { recipeRevisionListSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipeRoot } from "./keys";

/** Every revision of a recipe, newest first, each with what changed against the one before. */
export function getRevisions(shopId: string, recipeId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/revisions`), { schema: recipeRevisionListSchema, signal });
}

export const revisionsQueryOptions = (shopId: string, recipeId: string) =>
  queryOptions({
    queryKey: [...recipeRoot(shopId, recipeId), "revisions"],
    queryFn: ({ signal }) => getRevisions(shopId, recipeId, signal),
  });

export const useRevisions = (shopId: string, recipeId: string) => useQuery(revisionsQueryOptions(shopId, recipeId));
