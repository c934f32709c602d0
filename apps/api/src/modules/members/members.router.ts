import type { Router } from "express";
import { memberParamsSchema, paginationQuerySchema, updateMemberBodySchema } from "@ringdown/contracts";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { changeMemberRole, listShopMembers, removeMember } from "./members.service.js";

const listInput = { query: paginationQuerySchema };
const updateInput = { params: memberParamsSchema, body: updateMemberBodySchema };
const removeInput = { params: memberParamsSchema };

/** /api/shops/:shopId/members — every member reads the list; owners change roles and remove. */
export function registerMemberRoutes(router: Router): void {
  const owner = requireShopRole("owner");

  router.get("/members", validate(listInput), async (_req, res) => {
    const { query } = inputOf(res, listInput);
    res.json(await listShopMembers(currentShop(res).shop.id, query));
  });

  router.patch("/members/:userId", owner, validate(updateInput), async (_req, res) => {
    const { params, body } = inputOf(res, updateInput);
    res.json(await changeMemberRole(currentShop(res).shop.id, params.userId, body.role, requestActor(res)));
  });

  router.delete("/members/:userId", owner, validate(removeInput), async (_req, res) => {
    const { params } = inputOf(res, removeInput);
    await removeMember(currentShop(res).shop.id, params.userId, requestActor(res));
    res.status(204).end();
  });
}
