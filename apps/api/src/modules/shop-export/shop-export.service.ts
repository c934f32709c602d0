/**
 * Everything a shop owns, out of Ringdown: one JSON document (records in their API shapes, recipes
 * with every revision and status change) and CSV files per entity for spreadsheets. No lock-in.
 */
import type { Assembly, Cutter, CutLog, Recipe, ShopExport, ShopExportEntity, UnitSystem } from "@ringdown/contracts";
import { toUnitSystem } from "@ringdown/machining";
import { csvText, cuttersToCsv, INCH_DECIMALS, roundedCell, textCell } from "../cutters/cutters-csv.js";
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
 * Records in the audit log that `actor` took the shop's data out, naming the file ("json", always
 * SI, or an entity's CSV) and the CSV's units. Called once the export is built, before it is sent.
 */
export async function recordShopExport(
  shop: { id: string; name: string },
  actor: AuditActor,
  download: { file: "json" } | { file: ShopExportEntity; units: UnitSystem },
): Promise<void> {
  await inTransaction((tx) =>
    recordAuditEvent(tx, { shopId: shop.id, actor, action: "shop.exported", subject: { type: "shop", id: shop.id, label: shop.name }, detail: download }),
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

/** The measured quantities the CSV files hold, stored in the engine's base units (mm, mm/min, mm³/min). */
type Measured = "length" | "feedRate" | "volumeRate";

/**
 * Header suffix of each measured quantity per unit system, and the decimal places of its imperial
 * value. Values are converted with the engine's one units table (1 in = 25.4 mm exactly, NIST SP 811;
 * the international yard and pound agreement of 1959). Metric values stay as stored.
 */
const measuredColumns: Record<Measured, { suffix: Record<UnitSystem, string>; inchDecimals: number }> = {
  // Inch lengths as in the cutter list export: 0.000001 in, fine enough for chip loads and runout.
  length: { suffix: { metric: "mm", imperial: "in" }, inchDecimals: INCH_DECIMALS },
  feedRate: { suffix: { metric: "mm_per_min", imperial: "in_per_min" }, inchDecimals: 4 },
  volumeRate: { suffix: { metric: "mm3_per_min", imperial: "in3_per_min" }, inchDecimals: 4 },
};

/** One column of an export: its header (without the unit when `measured`), and its value for a row. */
type Column<T> = { header: string; value: (row: T) => string | number | boolean | null | undefined; measured?: Measured };

const metricNumberCell = (value: number): string => String(Number(value.toPrecision(10)));

function cellOf(value: string | number | boolean | null | undefined, measured: Measured | undefined, units: UnitSystem): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "boolean") return String(value);
  if (typeof value === "string") return textCell(value);
  if (!measured || units === "metric") return metricNumberCell(value);
  return roundedCell(toUnitSystem({ value, quantity: measured, system: units }).value, measuredColumns[measured].inchDecimals);
}

/** The rows as CSV in the chosen units: a measured column's header ends in its unit (`_mm`, `_in_per_min`…). */
function table<T>(columns: Array<Column<T>>, rows: T[], units: UnitSystem): string {
  const header = columns.map((c) => (c.measured ? `${c.header}_${measuredColumns[c.measured].suffix[units]}` : c.header));
  return csvText(header, rows.map((row) => columns.map((c) => cellOf(c.value(row), c.measured, units))));
}

const recipeColumns = (holders: Map<string, string>): Array<Column<Recipe>> => [
  { header: "id", value: (r) => r.id },
  { header: "name", value: (r) => r.name },
  { header: "status", value: (r) => r.status },
  { header: "revision", value: (r) => r.revision },
  { header: "machine", value: (r) => r.machineName },
  { header: "cutter", value: (r) => r.cutterName },
  { header: "holder", value: (r) => holders.get(r.assemblyId) },
  { header: "material", value: (r) => r.materialName },
  { header: "operation", value: (r) => r.operation },
  { header: "axial_depth", value: (r) => r.params.axialDepthMm, measured: "length" },
  { header: "radial_depth", value: (r) => r.params.radialDepthMm, measured: "length" },
  { header: "work_position_x", value: (r) => r.params.workPositionXMm, measured: "length" },
  { header: "work_position_y", value: (r) => r.params.workPositionYMm, measured: "length" },
  { header: "work_region_x_from", value: (r) => r.params.workRegion?.xMinMm, measured: "length" },
  { header: "work_region_x_to", value: (r) => r.params.workRegion?.xMaxMm, measured: "length" },
  { header: "work_region_y_from", value: (r) => r.params.workRegion?.yMinMm, measured: "length" },
  { header: "work_region_y_to", value: (r) => r.params.workRegion?.yMaxMm, measured: "length" },
  { header: "milling_direction", value: (r) => r.params.millingDirection },
  { header: "chosen_rpm", value: (r) => r.params.rpmOverride },
  // Chip loads are per tooth.
  { header: "chosen_chip_load", value: (r) => r.params.chipLoadOverrideMm, measured: "length" },
  { header: "rpm", value: (r) => r.result.rpm },
  { header: "feed", value: (r) => r.result.feedMmPerMin, measured: "feedRate" },
  { header: "chip_load", value: (r) => r.result.chipLoadMm, measured: "length" },
  { header: "removal_rate", value: (r) => r.result.materialRemovalRateMm3PerMin, measured: "volumeRate" },
  // Watts in both systems (the header says so).
  { header: "power_w", value: (r) => r.result.powerW },
  { header: "deflection", value: (r) => r.result.totalDeflectionMm, measured: "length" },
  { header: "binding_limit", value: (r) => r.result.bindingLimit },
  { header: "stable", value: (r) => (r.result.stable === null ? "not checked" : r.result.stable) },
  { header: "cut_logs", value: (r) => r.cutLogCount },
  { header: "author", value: (r) => r.authorName },
  { header: "notes", value: (r) => r.notes },
  { header: "last_comment", value: (r) => r.lastComment },
  { header: "created_at", value: (r) => r.createdAt },
  { header: "updated_at", value: (r) => r.updatedAt },
  { header: "deleted_at", value: (r) => r.deletedAt },
];

const cutLogColumns = (machineNames: Map<string, string>, materialNames: Map<string, string>): Array<Column<CutLog>> => [
  { header: "id", value: (l) => l.id },
  { header: "recipe_id", value: (l) => l.recipeId },
  { header: "recipe", value: (l) => l.recipeName },
  { header: "recipe_revision", value: (l) => l.recipeRevision },
  { header: "machine", value: (l) => machineNames.get(l.machineId) },
  { header: "material", value: (l) => materialNames.get(l.materialId) },
  { header: "cutter", value: (l) => l.cutterName },
  { header: "outcome", value: (l) => l.outcome },
  { header: "actual_rpm", value: (l) => l.actualRpm },
  { header: "actual_feed", value: (l) => l.actualFeedMmPerMin, measured: "feedRate" },
  { header: "axial_depth", value: (l) => l.axialDepthMm, measured: "length" },
  { header: "radial_depth", value: (l) => l.radialDepthMm, measured: "length" },
  { header: "feed_override_pct", value: (l) => l.feedOverridePct },
  { header: "note", value: (l) => l.note },
  { header: "logged_by", value: (l) => l.userName },
  { header: "photos", value: (l) => l.photos.length },
  { header: "created_at", value: (l) => l.createdAt },
];

type ShopAssembly = Assembly & { machineName: string; cutterName: string };

const assemblyColumns: Array<Column<ShopAssembly>> = [
  { header: "id", value: (a) => a.id },
  { header: "machine", value: (a) => a.machineName },
  { header: "cutter", value: (a) => a.cutterName },
  { header: "holder", value: (a) => a.holder },
  { header: "stickout", value: (a) => a.stickoutMm, measured: "length" },
  { header: "runout", value: (a) => a.runoutMm, measured: "length" },
  { header: "notes", value: (a) => a.notes },
  { header: "created_at", value: (a) => a.createdAt },
  { header: "updated_at", value: (a) => a.updatedAt },
];

/**
 * One entity of the shop as CSV (live rows; the JSON export also carries deleted ones), measured
 * columns in the chosen units.
 */
export async function exportShopCsv(shopId: string, entity: ShopExportEntity, units: UnitSystem): Promise<string> {
  switch (entity) {
    case "cutters": {
      const cutters: Cutter[] = (await listShopCutters(shopId)).filter((c) => !c.deletedAt);
      // The same column set the cutter import reads, so this file imports back as it is.
      return cuttersToCsv(cutters, units);
    }
    case "assemblies": {
      const list = (await listShopAssemblies(shopId)).filter((a) => !a.deletedAt);
      return table(assemblyColumns, list, units);
    }
    case "recipes": {
      const [recipes, assemblies] = await Promise.all([listAllRecipes(shopId), listShopAssemblies(shopId)]);
      return table(recipeColumns(new Map(assemblies.map((a) => [a.id, a.holder]))), recipes.filter((r) => !r.deletedAt), units);
    }
    case "cut-logs": {
      const [logs, machines, materials, globals] = await Promise.all([
        listAllCutLogs(shopId),
        listShopMachines(shopId),
        listShopMaterials(shopId),
        listGlobalMaterialsUsedBy(shopId),
      ]);
      const machineNames = new Map(machines.map((m) => [m.id, m.name]));
      const materialNames = new Map([...materials, ...globals].map((m) => [m.id, m.name]));
      return table(cutLogColumns(machineNames, materialNames), logs, units);
    }
  }
}
