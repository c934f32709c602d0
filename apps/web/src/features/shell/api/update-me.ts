import { meSchema, type Me, type UnitSystem, type UpdateMeBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { meQueryKey } from "@/lib/query-client";

export function updateMe(body: UpdateMeBody) {
  return apiRequest("/me", { method: "PATCH", body, schema: meSchema });
}

/** Makes another of the person's shops the active one; every shop-scoped answer is refetched. */
export function useSwitchShop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (shopId: string) => updateMe({ activeShopId: shopId }),
    onSuccess: async (me) => {
      queryClient.setQueryData(meQueryKey, me);
      await queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
    },
  });
}

/** Stores the person's metric/imperial display preference (shown at once, undone if refused). */
export function useSetUnitSystem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (unitSystem: UnitSystem) => updateMe({ unitSystem }),
    onMutate: async (unitSystem) => {
      await queryClient.cancelQueries({ queryKey: meQueryKey });
      const previous = queryClient.getQueryData<Me | null>(meQueryKey);
      if (previous) queryClient.setQueryData<Me>(meQueryKey, { ...previous, user: { ...previous.user, unitSystem } });
      return { previous };
    },
    onError: (_error, _unitSystem, context) => {
      if (context?.previous) queryClient.setQueryData(meQueryKey, context.previous);
    },
    onSuccess: (me) => {
      queryClient.setQueryData(meQueryKey, me);
    },
  });
}
