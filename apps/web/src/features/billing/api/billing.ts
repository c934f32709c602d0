import { billingStatusSchema, checkoutStartedSchema } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's billing; the team's plan query lives under "team". */
export function billingKey(shopId: string) {
  return ["shops", shopId, "billing"] as const;
}

export const billingQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: billingKey(shopId),
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, "/billing"), { schema: billingStatusSchema, signal }),
  });

export function useBilling(shopId: string) {
  return useQuery(billingQueryOptions(shopId));
}

/** After any billing change: the new status, and the team page's plan/seat numbers refetched. */
function useBillingMutation<V>(shopId: string, path: string, body: (v: V) => unknown) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (v: V) => apiRequest(shopApiPath(shopId, path), { method: "POST", body: body(v), schema: billingStatusSchema }),
    onSuccess: async (status) => {
      queryClient.setQueryData(billingKey(shopId), status);
      await queryClient.invalidateQueries({ queryKey: ["shops", shopId, "team"] });
    },
  });
}

export function useStartCheckout(shopId: string) {
  return useMutation({
    mutationFn: (seats: number) =>
      apiRequest(shopApiPath(shopId, "/billing/checkout"), { method: "POST", body: { seats }, schema: checkoutStartedSchema }),
  });
}

export const useConfirmCheckout = (shopId: string) => useBillingMutation(shopId, "/billing/checkout/confirm", (sessionId: string) => ({ sessionId }));
export const useChangeSeats = (shopId: string) => useBillingMutation(shopId, "/billing/seats", (seats: number) => ({ seats }));
export const useCancelPlan = (shopId: string) => useBillingMutation(shopId, "/billing/cancel", () => undefined);
export const useResumePlan = (shopId: string) => useBillingMutation(shopId, "/billing/resume", () => undefined);
