import type { Router } from "express";
import { auditEventListQuerySchema } from "@ringdown/contracts";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { listShopAuditEvents } from "./audit.service.js";

const listInput = { query: auditEventListQuerySchema };

/** GET /api/shops/:shopId/audit-events — the shop's change log, owners only, newest first. */
export function registerAuditRoutes(router: Router): void {
  router.get("/audit-events", requireShopRole("owner"), validate(listInput), async (_req, res) => {
    res.json(await listShopAuditEvents(currentShop(res).shop.id, inputOf(res, listInput).query));
  });
}
