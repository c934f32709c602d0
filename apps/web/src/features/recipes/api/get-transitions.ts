import { recipeTransitionListSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipeRoot } from "./keys";

/** The recipe's status changes with their comments, newest first. */
export function getTransitions(shopId: string, recipeId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/transitions`), { schema: recipeTransitionListSchema, signal });
}

export const transitionsQueryOptions = (shopId: string, recipeId: string) =>
  queryOptions({
    queryKey: [...recipeRoot(shopId, recipeId), "transitions"],
    queryFn: ({ signal }) => getTransitions(shopId, recipeId, signal),
  });

export const useTransitions = (shopId: string, recipeId: string) => useQuery(transitionsQueryOptions(shopId, recipeId));
