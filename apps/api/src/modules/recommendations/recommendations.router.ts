import type { Router } from "express";
import { recommendationBodySchema } from "@ringdown/contracts";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { recommendForShop } from "./recommendations.service.js";

const recommendInput = { body: recommendationBodySchema };

/**
 * POST /api/shops/:shopId/recommendations — runs the engine on the server for the shop's assembly
 * and material (any member: it reads only). Engine input errors answer 400 with field messages.
 */
export function registerRecommendationRoutes(router: Router): void {
  router.post("/recommendations", validate(recommendInput), async (_req, res) => {
    const { body } = inputOf(res, recommendInput);
    res.json(await recommendForShop(currentShop(res).shop.id, body));
  });
}
