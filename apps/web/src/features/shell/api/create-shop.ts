import { shopSchema, type CreateShopBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { meQueryKey } from "@/lib/query-client";

export function createShop(body: CreateShopBody) {
  return apiRequest("/shops", { method: "POST", body, schema: shopSchema });
}

/** Creates a shop owned by the caller; the API makes it the active shop. */
export function useCreateShop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createShop,
    onSuccess: async () => {
      // Wait for the refetch so the switcher already names the new shop when the dialog closes.
      await queryClient.invalidateQueries();
    },
  });
}
