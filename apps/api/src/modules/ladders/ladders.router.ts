import type { Router } from "express";
import { ladderBodySchema, ladderChooseBodySchema, ladderScoreBodySchema } from "@ringdown/contracts";
import { currentUser } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { recipeIdOf, shopAndActor } from "../recipes/recipes.router.js";
import { buildLadder, chooseRung, latestLadder, scoreRung } from "./ladders.service.js";

const buildInput = { body: ladderBodySchema };
const scoreInput = { body: ladderScoreBodySchema };
const chooseInput = { body: ladderChooseBodySchema };

/**
 * /api/shops/:shopId/recipes/:recipeId/ladder… Programmers and up build a ladder and choose its
 * best rung; every member who may log cuts on the recipe (operators: approved recipes and recipes
 * on trial) reads it and scores rungs.
 */
export function registerLadderRoutes(router: Router): void {
  const programmer = requireShopRole("programmer");

  router.post("/recipes/:recipeId/ladder", programmer, validate(buildInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.status(201).json(await buildLadder(shopId, recipeIdOf(req), inputOf(res, buildInput).body, actor));
  });

  router.get("/recipes/:recipeId/ladder", async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await latestLadder(shopId, recipeIdOf(req), actor));
  });

  router.post("/recipes/:recipeId/ladder/score", validate(scoreInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await scoreRung(shopId, recipeIdOf(req), inputOf(res, scoreInput).body, { ...actor, name: currentUser(res).name }));
  });

  router.post("/recipes/:recipeId/ladder/choose", programmer, validate(chooseInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await chooseRung(shopId, recipeIdOf(req), inputOf(res, chooseInput).body, actor));
  });
}
