import type { Router } from "express";
import {
  assemblyBodySchema,
  assemblyListQuerySchema,
  assemblyPatchBodySchema,
  recordIdSchema,
} from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import {
  createAssembly,
  deleteAssembly,
  getAssembly,
  listShopAssemblies,
  patchAssembly,
  restoreAssembly,
} from "./assemblies.service.js";

const listInput = { query: assemblyListQuerySchema };
const createInput = { body: assemblyBodySchema };
const patchInput = { body: assemblyPatchBodySchema };

function assemblyId(raw: unknown): string {
  const parsed = recordIdSchema.safeParse(raw);
  if (!parsed.success) throw AppError.notFound("Assembly not found.");
  return parsed.data;
}

/** /api/shops/:shopId/assemblies — every member reads; programmers and up add, edit, delete, restore. */
export function registerAssemblyRoutes(router: Router): void {
  const programmer = requireShopRole("programmer");

  router.get("/assemblies", validate(listInput), async (_req, res) => {
    res.json(await listShopAssemblies(currentShop(res).shop.id, inputOf(res, listInput).query));
  });

  router.post("/assemblies", programmer, validate(createInput), async (_req, res) => {
    res.status(201).json(await createAssembly(currentShop(res).shop.id, inputOf(res, createInput).body));
  });

  router.get("/assemblies/:assemblyId", async (req, res) => {
    res.json(await getAssembly(currentShop(res).shop.id, assemblyId(req.params.assemblyId)));
  });

  router.patch("/assemblies/:assemblyId", programmer, validate(patchInput), async (req, res) => {
    const id = assemblyId(req.params.assemblyId);
    res.json(await patchAssembly(currentShop(res).shop.id, id, inputOf(res, patchInput).body));
  });

  router.delete("/assemblies/:assemblyId", programmer, async (req, res) => {
    await deleteAssembly(currentShop(res).shop.id, assemblyId(req.params.assemblyId));
    res.status(204).end();
  });

  router.post("/assemblies/:assemblyId/restore", programmer, async (req, res) => {
    res.json(await restoreAssembly(currentShop(res).shop.id, assemblyId(req.params.assemblyId)));
  });
}
