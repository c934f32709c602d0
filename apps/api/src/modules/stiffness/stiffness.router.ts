import type { Router } from "express";
import { stiffnessMapQuerySchema, stiffnessReadingBodySchema } from "@ringdown/contracts";
import { currentShop, currentUser } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { idParam } from "../vibration/ids.js";
import { addReading, listReadings, removeReading, stiffnessMap } from "./stiffness.service.js";

const createInput = { body: stiffnessReadingBodySchema };
const mapInput = { query: stiffnessMapQuerySchema };

/**
 * /api/shops/:shopId/machines/:machineId/stiffness-readings and /stiffness-map — every member
 * reads; owners and tooling managers add and delete readings.
 */
export function registerStiffnessRoutes(router: Router): void {
  const manager = requireShopRole("tooling_manager");
  const base = "/machines/:machineId/stiffness-readings";

  router.get(base, async (req, res) => {
    res.json(await listReadings(currentShop(res).shop.id, idParam(req.params.machineId, "Machine")));
  });

  router.post(base, manager, validate(createInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.status(201).json(await addReading(currentShop(res).shop.id, machineId, inputOf(res, createInput).body, { ...requestActor(res), userId: currentUser(res).id }));
  });

  router.delete(`${base}/:readingId`, manager, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await removeReading(currentShop(res).shop.id, machineId, idParam(req.params.readingId, "Stiffness reading"), requestActor(res)));
  });

  router.get("/machines/:machineId/stiffness-map", validate(mapInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await stiffnessMap(currentShop(res).shop.id, machineId, inputOf(res, mapInput).query.cells));
  });
}
