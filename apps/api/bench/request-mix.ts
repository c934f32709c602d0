/**
 * What people ask the recipe list for, as the web app sends it: shared by the search and the
 * mixed-workload benchmarks.
 */
import type { BenchShop } from "./bench-data.js";
import { pick } from "./load.js";

const FREE_TEXT = ["bracket", "job 1234", "4711", "clamp", "air blast", "6 mm", "acrylic", "compression", "nameplate", "chatter"];

/** One list query as the web app's recipe list sends it, drawn from a mix of what people do. */
export function listQuery(random: () => number, shop: BenchShop): Record<string, string> {
  const r = random();
  const pageSize = random() < 0.8 ? "25" : "50";
  if (r < 0.3) return {}; // the list as it opens: newest first
  if (r < 0.4) return { page: String(2 + Math.floor(random() * 4)), pageSize };
  if (r < 0.5) return { status: pick(random, ["approved", "trial", "proven", "draft"]) };
  if (r < 0.58) return { machineId: pick(random, shop.machineIds), pageSize };
  if (r < 0.65) return { materialId: pick(random, shop.materialIds), sort: "name", order: "asc" };
  if (r < 0.7) return { operation: pick(random, ["slot", "profile", "pocket", "finish"]), sort: "rpm", order: pick(random, ["asc", "desc"]) };
  if (r < 0.85) return { q: pick(random, FREE_TEXT) };
  if (r < 0.92) return { sort: pick(random, ["machineName", "materialName", "cutterName", "name", "status"]), order: pick(random, ["asc", "desc"]) };
  if (r < 0.95) return { cutterId: pick(random, shop.cutterIds), status: "approved" };
  return { page: String(50 + Math.floor(random() * 150)) }; // deep in the list
}

export function listKind(query: Record<string, string>): string {
  if (query.q) return "free text";
  if (query.machineId || query.materialId || query.cutterId || query.operation || query.status) return "filter";
  if (query.sort) return "sort";
  if (query.page) return "later page";
  return "first page";
}
