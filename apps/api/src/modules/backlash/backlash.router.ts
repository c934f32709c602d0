import type { Router } from "express";
import { backlashReadingBodySchema } from "@ringdown/contracts";
import { currentShop, currentUser } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { idParam } from "../vibration/ids.js";
import { addBacklash, listBacklash, removeBacklash } from "./backlash.service.js";

const createInput = { body: backlashReadingBodySchema };

/** /api/shops/:shopId/machines/:machineId/backlash-readings — every member reads; owners and tooling managers add and delete. */
export function registerBacklashRoutes(router: Router): void {
  const manager = requireShopRole("tooling_manager");
  const base = "/machines/:machineId/backlash-readings";

  router.get(base, async (req, res) => {
    res.json(await listBacklash(currentShop(res).shop.id, idParam(req.params.machineId, "Machine")));
  });

  router.post(base, manager, validate(createInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.status(201).json(await addBacklash(currentShop(res).shop.id, machineId, inputOf(res, createInput).body, { ...requestActor(res), userId: currentUser(res).id }));
  });

  router.delete(`${base}/:readingId`, manager, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await removeBacklash(currentShop(res).shop.id, machineId, idParam(req.params.readingId, "Backlash reading"), requestActor(res)));
  });
}
