import { cutLogSchema, type CutLogBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

export interface NewCutLog {
  recipeId: string;
  body: CutLogBody;
  /** Photos of the cut (camera or files); sent as multipart when present. */
  photos: File[];
}

/** Logs one cut against a recipe; with photos it goes as multipart: the body as JSON text in `data`, files in `photos`. */
export function createCutLog(shopId: string, { recipeId, body, photos }: NewCutLog) {
  const path = shopApiPath(shopId, `/recipes/${encodeURIComponent(recipeId)}/cut-logs`);
  if (photos.length === 0) return apiRequest(path, { method: "POST", body, schema: cutLogSchema });
  const form = new FormData();
  form.set("data", JSON.stringify(body));
  for (const photo of photos) form.append("photos", photo, photo.name);
  return apiRequest(path, { method: "POST", body: form, schema: cutLogSchema });
}

export function useCreateCutLog(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: NewCutLog) => createCutLog(shopId, input),
    onSuccess: async () => {
      // Cut logs feed the recipe page (mark proven), the planner's evidence and the list.
      await queryClient.invalidateQueries({ queryKey: ["shops", shopId, "cut-logs"] });
      await queryClient.invalidateQueries({ queryKey: ["shops", shopId, "recipes"] });
    },
  });
}
