import { recommendationResponseSchema, type RecommendationBody } from "@ringdown/contracts";
import type { Recommendation } from "@ringdown/machining";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/**
 * The server's full engine result for a recipe's choices against today's library (limits,
 * warnings, explanations): the recipe page and setup card show it beside the stored summary.
 */
export async function getRecommendation(shopId: string, body: RecommendationBody, signal?: AbortSignal) {
  const response = await apiRequest(shopApiPath(shopId, "/recommendations"), { method: "POST", body, schema: recommendationResponseSchema, signal });
  // The contract checks the headline fields and passes the rest of the engine's output through.
  return { ...response, recommendation: response.recommendation as unknown as Recommendation };
}

export const recommendationQueryOptions = (shopId: string, body: RecommendationBody) =>
  queryOptions({
    queryKey: ["shops", shopId, "recommendation", body],
    queryFn: ({ signal }) => getRecommendation(shopId, body, signal),
  });

export const useRecommendation = (shopId: string, body: RecommendationBody | null) =>
  useQuery({ ...recommendationQueryOptions(shopId, body ?? ({} as RecommendationBody)), enabled: body !== null });
