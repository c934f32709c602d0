import type { ShopExportEntity, UnitSystem } from "@ringdown/contracts";
import { shopApiPath, toSearch } from "@/lib/active-shop";

/*
 * Addresses of the whole-shop export. Plain links download them: the session cookie goes along on
 * the same origin, and the server names each file (Content-Disposition) and records the download in
 * the shop's change history.
 */

/** Everything the shop keeps, as one JSON document in SI units. */
export function shopExportJsonUrl(shopId: string): string {
  return `/api${shopApiPath(shopId, `/export${toSearch({ format: "json" })}`)}`;
}

/** One kind of record as CSV, measured columns in the chosen unit system. */
export function shopExportCsvUrl(shopId: string, entity: ShopExportEntity, units: UnitSystem): string {
  return `/api${shopApiPath(shopId, `/export/${entity}.csv${toSearch({ units })}`)}`;
}
