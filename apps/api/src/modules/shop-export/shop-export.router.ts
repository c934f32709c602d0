import type { Router } from "express";
import { shopExportCsvQuerySchema, shopExportEntitySchema, shopExportQuerySchema } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { exportShopCsv, exportShopJson, recordShopExport } from "./shop-export.service.js";
import { requestActor } from "../audit/audit-actor.js";

const jsonInput = { query: shopExportQuerySchema };
const csvInput = { query: shopExportCsvQuerySchema };

/** A file-name-safe form of the shop's name. */
function slug(name: string): string {
  return name.toLowerCase().normalize("NFKD").replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "shop";
}
const today = (): string => new Date().toISOString().slice(0, 10);

/**
 * GET /api/shops/:shopId/export?format=json and /export/<cutters|assemblies|recipes|cut-logs>.csv:
 * everything the shop owns, for owners and tooling managers. The JSON is SI throughout; the CSV files
 * take `?units=metric|imperial` (default metric) and name each column's unit in its header.
 */
export function registerShopExportRoutes(router: Router): void {
  const curators = requireShopRole("tooling_manager");

  router.get("/export", curators, validate(jsonInput), async (_req, res) => {
    inputOf(res, jsonInput);
    const { shop } = currentShop(res);
    const body = await exportShopJson(shop);
    await recordShopExport(shop, requestActor(res), { file: "json" });
    res.setHeader("Content-Disposition", `attachment; filename="ringdown-${slug(shop.name)}-${today()}.json"`);
    res.json(body);
  });

  router.get("/export/:file", curators, validate(csvInput), async (req, res) => {
    const { units } = inputOf(res, csvInput).query;
    const match = /^([a-z-]+)\.csv$/.exec(String(req.params.file));
    const entity = shopExportEntitySchema.safeParse(match?.[1]);
    if (!entity.success) throw AppError.notFound("No such export. Use cutters.csv, assemblies.csv, recipes.csv or cut-logs.csv.");
    const { shop } = currentShop(res);
    const text = await exportShopCsv(shop.id, entity.data, units);
    await recordShopExport(shop, requestActor(res), { file: entity.data, units });
    const unitsSuffix = units === "imperial" ? "-inch" : "";
    res.setHeader("Content-Type", "text/csv; charset=utf-8");
    res.setHeader("Content-Disposition", `attachment; filename="ringdown-${slug(shop.name)}-${entity.data}-${today()}${unitsSuffix}.csv"`);
    res.send(text);
  });
}
