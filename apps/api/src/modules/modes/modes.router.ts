import type { Router } from "express";
import { modeBodySchema, modePatchBodySchema } from "@ringdown/contracts";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { idParam } from "../vibration/ids.js";
import { createMode, listMachineModes, patchMode, removeMode } from "./modes.service.js";

const createInput = { body: modeBodySchema };
const patchInput = { body: modePatchBodySchema };

/** /api/shops/:shopId/machines/:machineId/modes — every member reads; owners and tooling managers edit. */
export function registerModeRoutes(router: Router): void {
  const manager = requireShopRole("tooling_manager");
  const base = "/machines/:machineId/modes";

  router.get(base, async (req, res) => {
    res.json(await listMachineModes(currentShop(res).shop.id, idParam(req.params.machineId, "Machine")));
  });

  router.post(base, manager, validate(createInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.status(201).json(await createMode(currentShop(res).shop.id, machineId, inputOf(res, createInput).body, requestActor(res)));
  });

  router.patch(`${base}/:modeId`, manager, validate(patchInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await patchMode(currentShop(res).shop.id, machineId, idParam(req.params.modeId, "Mode"), inputOf(res, patchInput).body, requestActor(res)));
  });

  router.delete(`${base}/:modeId`, manager, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await removeMode(currentShop(res).shop.id, machineId, idParam(req.params.modeId, "Mode"), requestActor(res)));
  });
}
