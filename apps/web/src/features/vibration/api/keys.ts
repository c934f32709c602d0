import type { QueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";

/** Everything cached about one machine's vibration profile starts with this key. */
export function vibrationKey(shopId: string, machineId: string) {
  return ["shops", shopId, "vibration", machineId] as const;
}

/** `/shops/<shop>/machines/<machine><path>` */
export function machineApiPath(shopId: string, machineId: string, path: string): string {
  return shopApiPath(shopId, `/machines/${encodeURIComponent(machineId)}${path}`);
}

/**
 * After a change to a machine's profile: its readings, modes and ceilings, the machine itself
 * (stiffness, backlash, modes and dial speeds live on it, and the planner reads them) and, when
 * recipes were flagged for a re-check, the recipe lists.
 */
export async function invalidateAfterProfileChange(queryClient: QueryClient, shopId: string, machineId: string, recipesFlagged = 0) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: vibrationKey(shopId, machineId) }),
    queryClient.invalidateQueries({ queryKey: ["shops", shopId, "machines"] }),
    recipesFlagged > 0 ? queryClient.invalidateQueries({ queryKey: ["shops", shopId, "recipes"] }) : Promise.resolve(),
  ]);
}
