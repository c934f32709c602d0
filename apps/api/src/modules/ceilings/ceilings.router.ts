import type { Router } from "express";
import { ceilingsBodySchema } from "@ringdown/contracts";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { idParam } from "../vibration/ids.js";
import { getCeilings, putCeilings } from "./ceilings.service.js";

const putInput = { body: ceilingsBodySchema };

/** /api/shops/:shopId/machines/:machineId/ceilings — every member reads; owners and tooling managers replace them. */
export function registerCeilingRoutes(router: Router): void {
  const manager = requireShopRole("tooling_manager");
  router.get("/machines/:machineId/ceilings", async (req, res) => {
    res.json(await getCeilings(currentShop(res).shop.id, idParam(req.params.machineId, "Machine")));
  });
  router.put("/machines/:machineId/ceilings", manager, validate(putInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await putCeilings(currentShop(res).shop.id, machineId, inputOf(res, putInput).body, requestActor(res)));
  });
}
