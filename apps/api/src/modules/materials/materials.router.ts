import type { Router } from "express";
import {
  materialBodySchema,
  materialCopyBodySchema,
  materialListQuerySchema,
  materialPatchBodySchema,
  recordIdSchema,
} from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import {
  copyMaterial,
  createMaterial,
  deleteMaterial,
  getMaterial,
  listShopMaterials,
  patchMaterial,
  restoreMaterial,
} from "./materials.service.js";

const listInput = { query: materialListQuerySchema };
const createInput = { body: materialBodySchema };
const patchInput = { body: materialPatchBodySchema };
const copyInput = { body: materialCopyBodySchema };

/** A malformed id names no material: 404, like a missing one. */
function materialId(raw: unknown): string {
  const parsed = recordIdSchema.safeParse(raw);
  if (!parsed.success) throw AppError.notFound("Material not found.");
  return parsed.data;
}

/**
 * /api/shops/:shopId/materials — every member reads (global rows plus the shop's own); tooling
 * managers and owners add, copy, edit, delete and restore the shop's own rows.
 */
export function registerMaterialRoutes(router: Router): void {
  const manager = requireShopRole("tooling_manager");

  router.get("/materials", validate(listInput), async (_req, res) => {
    res.json(await listShopMaterials(currentShop(res).shop.id, inputOf(res, listInput).query));
  });

  router.post("/materials", manager, validate(createInput), async (_req, res) => {
    res.status(201).json(await createMaterial(currentShop(res).shop.id, inputOf(res, createInput).body, requestActor(res)));
  });

  router.get("/materials/:materialId", async (req, res) => {
    res.json(await getMaterial(currentShop(res).shop.id, materialId(req.params.materialId)));
  });

  router.patch("/materials/:materialId", manager, validate(patchInput), async (req, res) => {
    const id = materialId(req.params.materialId);
    res.json(await patchMaterial(currentShop(res).shop.id, id, inputOf(res, patchInput).body, requestActor(res)));
  });

  router.delete("/materials/:materialId", manager, async (req, res) => {
    await deleteMaterial(currentShop(res).shop.id, materialId(req.params.materialId), requestActor(res));
    res.status(204).end();
  });

  router.post("/materials/:materialId/copy", manager, validate(copyInput), async (req, res) => {
    const id = materialId(req.params.materialId);
    res.status(201).json(await copyMaterial(currentShop(res).shop.id, id, inputOf(res, copyInput).body.name, requestActor(res)));
  });

  router.post("/materials/:materialId/restore", manager, async (req, res) => {
    res.json(await restoreMaterial(currentShop(res).shop.id, materialId(req.params.materialId), requestActor(res)));
  });
}
