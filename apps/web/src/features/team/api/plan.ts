import { shopPlanSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { teamKey } from "./members";

/** The shop's plan and seat use (any member may read it). Under the team key: team changes refresh it. */
export const planQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: [...teamKey(shopId), "plan"] as const,
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, "/plan"), { schema: shopPlanSchema, signal }),
  });

export function usePlan(shopId: string) {
  return useQuery(planQueryOptions(shopId));
}
