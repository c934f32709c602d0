/**
 * The ladder's three writes: build (programmers and up), score a rung (anyone who may log cuts;
 * the score is also written to the cut log) and choose the best rung (becomes the next revision).
 */
import { ladderSchema, type LadderBody, type LadderChooseBody, type LadderScoreBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { recipesRoot } from "./keys";

const ladderPath = (shopId: string, recipeId: string, tail = "") => shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/ladder${tail}`);

export function createLadder(shopId: string, recipeId: string, body: LadderBody) {
  return apiRequest(ladderPath(shopId, recipeId), { method: "POST", body, schema: ladderSchema });
}

export function scoreRung(shopId: string, recipeId: string, body: LadderScoreBody) {
  return apiRequest(ladderPath(shopId, recipeId, "/score"), { method: "POST", body, schema: ladderSchema });
}

export function chooseRung(shopId: string, recipeId: string, body: LadderChooseBody) {
  return apiRequest(ladderPath(shopId, recipeId, "/choose"), { method: "POST", body, schema: ladderSchema });
}

function useLadderMutation<B>(shopId: string, fn: (body: B) => Promise<unknown>, alsoCutLogs = false) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: recipesRoot(shopId) });
      if (alsoCutLogs) await queryClient.invalidateQueries({ queryKey: ["shops", shopId, "cut-logs"] });
    },
  });
}

export const useCreateLadder = (shopId: string, recipeId: string) => useLadderMutation(shopId, (body: LadderBody) => createLadder(shopId, recipeId, body));
export const useScoreRung = (shopId: string, recipeId: string) =>
  useLadderMutation(shopId, (body: LadderScoreBody) => scoreRung(shopId, recipeId, body), true);
export const useChooseRung = (shopId: string, recipeId: string) =>
  useLadderMutation(shopId, (body: LadderChooseBody) => chooseRung(shopId, recipeId, body));
