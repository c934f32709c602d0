/**
 * Everything a shop owns, out of Ringdown: one JSON document (records in their API shapes, recipes
 * with every revision and status change) and CSV files per entity for spreadsheets. No lock-in.
 */
import { stringify } from "csv-stringify/sync";
import type { Cutter, CutLog, Recipe, ShopExport, ShopExportEntity } from "@ringdown/contracts";
import { cuttersToCsv } from "../cutters/cutters-csv.js";
import { listAllCutLogs } from "../cut-logs/cut-logs.repository.js";
import { listAllLadders } from "../ladders/ladders.repository.js";
import {
  listGlobalMaterialsUsedBy,
  listShopAssemblies,
  listShopCutters,
  listShopMachines,
  listShopMaterials,
} from "../recommendations/planning.repository.js";
import { listAllRecipes, listShopRevisions, listShopTransitions, type RevisionRecord } from "../recipes/recipes.repository.js";
import { toRevisionResponses } from "../recipes/recipes.service.js";
import { inTransaction } from "../../db/sequelize.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";

/**
 * Records in the audit log that `actor` took the shop's data out (`file`: "json" or an entity's
 * CSV). Called once the export is built, before it is sent.
 */
export async function recordShopExport(shop: { id: string; name: string }, actor: AuditActor, file: "json" | ShopExportEntity): Promise<void> {
  await inTransaction((tx) =>
    recordAuditEvent(tx, { shopId: shop.id, actor, action: "shop.exported", subject: { type: "shop", id: shop.id, label: shop.name }, detail: { file } }),
  );
}

export async function exportShopJson(shop: { id: string; name: string }): Promise<ShopExport> {
  const shopId = shop.id;
  const [materials, globals, cutters, machines, assemblies, recipes, revisions, transitions, cutLogs, ladders] = await Promise.all([
    listShopMaterials(shopId),
    listGlobalMaterialsUsedBy(shopId),
    listShopCutters(shopId),
    listShopMachines(shopId),
    listShopAssemblies(shopId),
    listAllRecipes(shopId),
    listShopRevisions(shopId),
    listShopTransitions(shopId),
    listAllCutLogs(shopId),
    listAllLadders(shopId),
  ]);
  const revisionsBy = groupBy(revisions, (r) => r.recipeId);
  const transitionsBy = groupBy(transitions, (t) => t.recipeId);
  return {
    format: "ringdown-shop-export",
    version: 1,
    exportedAt: new Date().toISOString(),
    shop: { id: shop.id, name: shop.name },
    units: "SI: lengths mm, speeds rpm and m/min, feeds mm/min, power W, stiffness N/mm, frequency Hz",
    materials: [...materials, ...globals],
    cutters,
    machines,
    assemblies,
    recipes: recipes.map((r) => ({
      ...r,
      revisions: toRevisionResponses(revisionsBy.get(r.id) ?? ([] as RevisionRecord[])),
      transitions: [...(transitionsBy.get(r.id) ?? [])].reverse(),
    })),
    cutLogs,
    ladders,
  };
}

function groupBy<T>(items: T[], key: (item: T) => string): Map<string, T[]> {
  const map = new Map<string, T[]>();
  for (const item of items) {
    const k = key(item);
    const list = map.get(k);
    if (list) list.push(item);
    else map.set(k, [item]);
  }
  return map;
}

// Spreadsheets run cells that start with these as formulas; text cells get a leading apostrophe.
const FORMULA_START = /^[=+\-@\t\r]/;
const textCell = (value: string | null | undefined): string => {
  const v = value ?? "";
  return FORMULA_START.test(v) ? `'${v}` : v;
};
const numberCell = (value: number | null | undefined): string => (value === null || value === undefined ? "" : String(Number(value.toPrecision(10))));

function csv(header: string[], rows: string[][]): string {
  // UTF-8 with a byte-order mark so spreadsheets read it as UTF-8; CRLF line ends (RFC 4180).
  return `\uFEFF${stringify([header, ...rows], { record_delimiter: "\r\n" })}`;
}

function recipesCsv(recipes: Recipe[], holders: Map<string, string>): string {
  const header = [
    "id", "name", "status", "revision", "machine", "cutter", "holder", "material", "operation",
    "axial_depth_mm", "radial_depth_mm", "work_position_x_mm", "work_position_y_mm",
    "work_region_x_from_mm", "work_region_x_to_mm", "work_region_y_from_mm", "work_region_y_to_mm", "milling_direction",
    "chosen_rpm", "chosen_chip_load_mm", "rpm", "feed_mm_per_min", "chip_load_mm", "removal_rate_mm3_per_min",
    "power_w", "deflection_mm", "binding_limit", "stable", "cut_logs", "author", "notes", "last_comment", "created_at", "updated_at", "deleted_at",
  ];
  const rows = recipes.map((r) => [
    r.id, textCell(r.name), r.status, String(r.revision), textCell(r.machineName), textCell(r.cutterName), textCell(holders.get(r.assemblyId)),
    textCell(r.materialName), r.operation,
    numberCell(r.params.axialDepthMm), numberCell(r.params.radialDepthMm), numberCell(r.params.workPositionXMm), numberCell(r.params.workPositionYMm),
    numberCell(r.params.workRegion?.xMinMm), numberCell(r.params.workRegion?.xMaxMm), numberCell(r.params.workRegion?.yMinMm), numberCell(r.params.workRegion?.yMaxMm),
    r.params.millingDirection, numberCell(r.params.rpmOverride), numberCell(r.params.chipLoadOverrideMm),
    numberCell(r.result.rpm), numberCell(r.result.feedMmPerMin), numberCell(r.result.chipLoadMm), numberCell(r.result.materialRemovalRateMm3PerMin),
    numberCell(r.result.powerW), numberCell(r.result.totalDeflectionMm), textCell(r.result.bindingLimit), r.result.stable === null ? "not checked" : String(r.result.stable),
    String(r.cutLogCount), textCell(r.authorName), textCell(r.notes), textCell(r.lastComment), r.createdAt, r.updatedAt, r.deletedAt ?? "",
  ]);
  return csv(header, rows);
}

function cutLogsCsv(logs: CutLog[], machineNames: Map<string, string>, materialNames: Map<string, string>): string {
  const header = [
    "id", "recipe_id", "recipe", "recipe_revision", "machine", "material", "cutter", "outcome", "actual_rpm", "actual_feed_mm_per_min",
    "axial_depth_mm", "radial_depth_mm", "feed_override_pct", "note", "logged_by", "photos", "created_at",
  ];
  const rows = logs.map((l) => [
    l.id, l.recipeId, textCell(l.recipeName), String(l.recipeRevision), textCell(machineNames.get(l.machineId)), textCell(materialNames.get(l.materialId)),
    textCell(l.cutterName), l.outcome, numberCell(l.actualRpm), numberCell(l.actualFeedMmPerMin), numberCell(l.axialDepthMm), numberCell(l.radialDepthMm),
    numberCell(l.feedOverridePct), textCell(l.note), textCell(l.userName), String(l.photos.length), l.createdAt,
  ]);
  return csv(header, rows);
}

/** One entity of the shop as CSV (live rows; the JSON export also carries deleted ones). */
export async function exportShopCsv(shopId: string, entity: ShopExportEntity): Promise<string> {
  switch (entity) {
    case "cutters": {
      const cutters: Cutter[] = (await listShopCutters(shopId)).filter((c) => !c.deletedAt);
      // The same column set the cutter import reads, so this file imports back as it is.
      return cuttersToCsv(cutters, "metric");
    }
    case "assemblies": {
      const list = (await listShopAssemblies(shopId)).filter((a) => !a.deletedAt);
      const header = ["id", "machine", "cutter", "holder", "stickout_mm", "runout_mm", "notes", "created_at", "updated_at"];
      return csv(
        header,
        list.map((a) => [a.id, textCell(a.machineName), textCell(a.cutterName), textCell(a.holder), numberCell(a.stickoutMm), numberCell(a.runoutMm), textCell(a.notes), a.createdAt, a.updatedAt]),
      );
    }
    case "recipes": {
      const [recipes, assemblies] = await Promise.all([listAllRecipes(shopId), listShopAssemblies(shopId)]);
      return recipesCsv(recipes.filter((r) => !r.deletedAt), new Map(assemblies.map((a) => [a.id, a.holder])));
    }
    case "cut-logs": {
      const [logs, machines, materials, globals] = await Promise.all([
        listAllCutLogs(shopId),
        listShopMachines(shopId),
        listShopMaterials(shopId),
        listGlobalMaterialsUsedBy(shopId),
      ]);
      return cutLogsCsv(logs, new Map(machines.map((m) => [m.id, m.name])), new Map([...materials, ...globals].map((m) => [m.id, m.name])));
    }
  }
}
