import { cutterSchema, type CutterCreateBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { cuttersKey } from "./get-cutters";

export function createCutter(shopId: string, body: CutterCreateBody) {
  return apiRequest(shopApiPath(shopId, "/cutters"), { method: "POST", body, schema: cutterSchema });
}

export function useCreateCutter(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CutterCreateBody) => createCutter(shopId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cuttersKey(shopId) }),
  });
}
