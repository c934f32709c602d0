import { cutLogPageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath, toSearch } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** The cuts logged against one recipe (newest first). */
export function getRecipeCutLogs(shopId: string, recipeId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/cut-logs${toSearch({ pageSize: 100 })}`), {
    schema: cutLogPageSchema,
    signal,
  });
}

export const recipeCutLogsQueryOptions = (shopId: string, recipeId: string) =>
  queryOptions({
    queryKey: ["shops", shopId, "cut-logs", "recipe", recipeId],
    queryFn: ({ signal }) => getRecipeCutLogs(shopId, recipeId, signal),
  });

export const useRecipeCutLogs = (shopId: string, recipeId: string) => useQuery(recipeCutLogsQueryOptions(shopId, recipeId));
