import type { CutterStatus, UnitSystem } from "@ringdown/contracts";
import { shopApiPath, toSearch } from "@/lib/active-shop";

/**
 * Address of the shop's cutter list as CSV. A plain link downloads it: the session cookie goes
 * along on the same origin and the server names the file (Content-Disposition).
 */
export function cutterExportUrl(shopId: string, units: UnitSystem, status?: CutterStatus): string {
  return `/api${shopApiPath(shopId, `/cutters/export${toSearch({ units, status })}`)}`;
}
