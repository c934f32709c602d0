import { Router } from "express";
import { updateMeBodySchema } from "@ringdown/contracts";
import { currentUser } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { getMe, updateMe } from "./me.service.js";

const updateInput = { body: updateMeBodySchema };

/** Mounted on /api/me behind requireSession. */
export function createMeRouter(): Router {
  const router = Router();

  router.get("/", async (_req, res) => {
    res.json(await getMe(currentUser(res).id));
  });

  router.patch("/", validate(updateInput), async (_req, res) => {
    const { body } = inputOf(res, updateInput);
    res.json(await updateMe(currentUser(res).id, body));
  });

  return router;
}
