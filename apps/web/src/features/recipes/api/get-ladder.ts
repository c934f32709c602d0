import { ladderSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest, isApiError } from "@/lib/api-client";
import { recipeRoot } from "./keys";

/** The recipe's latest test-cut ladder, or null when it has none yet. */
export async function getLadder(shopId: string, recipeId: string, signal?: AbortSignal) {
  try {
    return await apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/ladder`), { schema: ladderSchema, signal });
  } catch (error) {
    if (isApiError(error) && error.status === 404) return null;
    throw error;
  }
}

export const ladderQueryOptions = (shopId: string, recipeId: string) =>
  queryOptions({
    queryKey: [...recipeRoot(shopId, recipeId), "ladder"],
    queryFn: ({ signal }) => getLadder(shopId, recipeId, signal),
  });

export const useLadder = (shopId: string, recipeId: string, enabled = true) => useQuery({ ...ladderQueryOptions(shopId, recipeId), enabled });
