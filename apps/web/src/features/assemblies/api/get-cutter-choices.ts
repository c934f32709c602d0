import { cutterPageSchema } from "@ringdown/contracts";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** The shop's cutters to choose from when building an assembly (one page, by name). */
export function getCutterChoices(shopId: string, signal?: AbortSignal) {
  return apiRequest(shopApiPath(shopId, "/cutters?pageSize=200&sort=name"), { schema: cutterPageSchema, signal });
}

export const cutterChoicesQueryOptions = (shopId: string) =>
  queryOptions({
    // Under the cutters' key, so a change to the cutter list refreshes these choices too.
    queryKey: ["shops", shopId, "cutters", "choices"] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getCutterChoices(shopId, signal),
  });

export function useCutterChoices(shopId: string) {
  return useQuery(cutterChoicesQueryOptions(shopId));
}
