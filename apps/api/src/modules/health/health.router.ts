import { Router } from "express";
import { checkHealth } from "./health.service.js";

export function createHealthRouter(): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    const health = await checkHealth();
    res.status(health.database === "up" ? 200 : 503).set("Cache-Control", "no-store").json(health);
  });
  return router;
}
