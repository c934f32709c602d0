import type { Router } from "express";
import { paginationQuerySchema } from "@ringdown/contracts";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { listShopMembers } from "./members.service.js";

const listInput = { query: paginationQuerySchema };

/** /api/shops/:shopId/members — read-only here; managing the team comes with its own feature. */
export function registerMemberRoutes(router: Router): void {
  router.get("/members", validate(listInput), async (_req, res) => {
    const { query } = inputOf(res, listInput);
    res.json(await listShopMembers(currentShop(res).shop.id, query));
  });
}
