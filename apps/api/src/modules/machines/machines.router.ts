import type { Router } from "express";
import {
  machineBodySchema,
  machineDefaultsQuerySchema,
  machineListQuerySchema,
  machinePatchBodySchema,
  recordIdSchema,
} from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import {
  createMachine,
  defaultsForKind,
  deleteMachine,
  getMachine,
  listShopMachines,
  patchMachine,
  restoreMachine,
} from "./machines.service.js";

const listInput = { query: machineListQuerySchema };
const defaultsInput = { query: machineDefaultsQuerySchema };
const createInput = { body: machineBodySchema };
const patchInput = { body: machinePatchBodySchema };

function machineId(raw: unknown): string {
  const parsed = recordIdSchema.safeParse(raw);
  if (!parsed.success) throw AppError.notFound("Machine not found.");
  return parsed.data;
}

/**
 * /api/shops/:shopId/machines — every member reads; tooling managers and owners add, edit (modes
 * included), delete and restore machines.
 */
export function registerMachineRoutes(router: Router): void {
  const manager = requireShopRole("tooling_manager");

  router.get("/machines", validate(listInput), async (_req, res) => {
    res.json(await listShopMachines(currentShop(res).shop.id, inputOf(res, listInput).query));
  });

  router.post("/machines", manager, validate(createInput), async (_req, res) => {
    res.status(201).json(await createMachine(currentShop(res).shop.id, inputOf(res, createInput).body, requestActor(res)));
  });

  // Fixed path before /machines/:machineId.
  router.get("/machines/defaults", validate(defaultsInput), (_req, res) => {
    res.json(defaultsForKind(inputOf(res, defaultsInput).query.kind));
  });

  router.get("/machines/:machineId", async (req, res) => {
    res.json(await getMachine(currentShop(res).shop.id, machineId(req.params.machineId)));
  });

  router.patch("/machines/:machineId", manager, validate(patchInput), async (req, res) => {
    const id = machineId(req.params.machineId);
    res.json(await patchMachine(currentShop(res).shop.id, id, inputOf(res, patchInput).body, requestActor(res)));
  });

  router.delete("/machines/:machineId", manager, async (req, res) => {
    await deleteMachine(currentShop(res).shop.id, machineId(req.params.machineId), requestActor(res));
    res.status(204).end();
  });

  router.post("/machines/:machineId/restore", manager, async (req, res) => {
    res.json(await restoreMachine(currentShop(res).shop.id, machineId(req.params.machineId), requestActor(res)));
  });
}
