import type { Request, Response, Router } from "express";
import { z } from "zod";
import {
  recipeBodySchema,
  recipeCopyBodySchema,
  recipeListQuerySchema,
  recipeRestoreBodySchema,
  recipeTransitionBodySchema,
  recipeUpdateBodySchema,
} from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import {
  copyRecipe,
  createRecipe,
  deleteRecipe,
  listShopRecipes,
  recipeRevisions,
  recipeTransitions,
  restoreDeletedRecipe,
  restoreRevision,
  transitionRecipe,
  updateRecipe,
  visibleRecipe,
  type Actor,
} from "./recipes.service.js";

const uuid = z.string().uuid();

/** The `:recipeId` of the path; a malformed id is answered like a missing recipe. */
export function recipeIdOf(req: Request): string {
  const parsed = uuid.safeParse(req.params.recipeId);
  if (!parsed.success) throw AppError.notFound("Recipe not found.");
  return parsed.data;
}

/** The shop and the caller as the services need them. */
export function shopAndActor(res: Response): { shopId: string; actor: Actor } {
  const { shop, membership } = currentShop(res);
  return { shopId: shop.id, actor: { ...requestActor(res), userId: membership.userId, role: membership.role } };
}

const listInput = { query: recipeListQuerySchema };
const createInput = { body: recipeBodySchema };
const updateInput = { body: recipeUpdateBodySchema };
const restoreInput = { body: recipeRestoreBodySchema };
const transitionInput = { body: recipeTransitionBodySchema };
const copyInput = { body: recipeCopyBodySchema };

/**
 * /api/shops/:shopId/recipes… Every member reads (operators: approved recipes only); programmers
 * and up create, edit, restore, copy and delete; the life-cycle step decides who may take it.
 */
export function registerRecipeRoutes(router: Router): void {
  const programmer = requireShopRole("programmer");

  router.get("/recipes", validate(listInput), async (_req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await listShopRecipes(shopId, inputOf(res, listInput).query, actor));
  });

  router.post("/recipes", programmer, validate(createInput), async (_req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.status(201).json(await createRecipe(shopId, inputOf(res, createInput).body, actor));
  });

  router.get("/recipes/:recipeId", async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await visibleRecipe(shopId, recipeIdOf(req), actor));
  });

  router.patch("/recipes/:recipeId", programmer, validate(updateInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await updateRecipe(shopId, recipeIdOf(req), inputOf(res, updateInput).body, actor));
  });

  router.delete("/recipes/:recipeId", programmer, async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    await deleteRecipe(shopId, recipeIdOf(req), actor);
    res.status(204).end();
  });

  router.post("/recipes/:recipeId/restore-deleted", programmer, async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await restoreDeletedRecipe(shopId, recipeIdOf(req), actor));
  });

  router.get("/recipes/:recipeId/revisions", async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await recipeRevisions(shopId, recipeIdOf(req), actor));
  });

  router.post("/recipes/:recipeId/restore", programmer, validate(restoreInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    const { body } = inputOf(res, restoreInput);
    res.json(await restoreRevision(shopId, recipeIdOf(req), body.revision, body.changeNote, actor));
  });

  router.get("/recipes/:recipeId/transitions", async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await recipeTransitions(shopId, recipeIdOf(req), actor));
  });

  router.post("/recipes/:recipeId/transition", programmer, validate(transitionInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    const { body } = inputOf(res, transitionInput);
    res.json(await transitionRecipe(shopId, recipeIdOf(req), body.to, body.comment, actor));
  });

  router.post("/recipes/:recipeId/copy", programmer, validate(copyInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.status(201).json(await copyRecipe(shopId, recipeIdOf(req), inputOf(res, copyInput).body, actor));
  });
}
