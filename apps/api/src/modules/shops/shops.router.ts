import { Router } from "express";
import { createShopBodySchema, updateShopBodySchema } from "@ringdown/contracts";
import { currentShop, currentUser } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "./require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { createShop, describeShop, renameOwnShop } from "./shops.service.js";

const createInput = { body: createShopBodySchema };
const updateInput = { body: updateShopBodySchema };

/** POST /api/shops — not shop-scoped: any signed-in person may open a new shop. */
export function createShopsRouter(): Router {
  const router = Router();
  router.post("/", validate(createInput), async (_req, res) => {
    const { body } = inputOf(res, createInput);
    res.status(201).json(await createShop({ ...requestActor(res), userId: currentUser(res).id }, body.name));
  });
  return router;
}

/** Routes on /api/shops/:shopId itself (registered on the shop-scoped router). */
export function registerShopRoutes(router: Router): void {
  router.get("/", (_req, res) => {
    const { shop, membership } = currentShop(res);
    res.json(describeShop(shop, membership.role));
  });

  router.patch("/", requireShopRole("owner"), validate(updateInput), async (_req, res) => {
    const { body } = inputOf(res, updateInput);
    const { shop, membership } = currentShop(res);
    res.json(await renameOwnShop(shop.id, body.name, membership.role, requestActor(res)));
  });
}
