/**
 * Routes under /api/shops/:shopId. Every module registers its shop-scoped routes directly on this
 * one router (no nested routers), which sits behind `requireShopRole` for any member. Tests walk
 * this router's stack (see `listRoutes`) to prove that every shop-scoped route answers 404 to
 * non-members, so a new route cannot escape that check.
 */
import { Router } from "express";
import { readConfig, type AppConfig } from "./config/env.js";
import { registerMemberRoutes } from "./modules/members/members.router.js";
import { registerInvitationRoutes } from "./modules/invitations/invitations.router.js";
import { registerBillingRoutes } from "./modules/billing/billing.router.js";
import { registerShopRoutes } from "./modules/shops/shops.router.js";
import { registerMaterialRoutes } from "./modules/materials/materials.router.js";
import { registerCutterRoutes } from "./modules/cutters/cutters.router.js";
import { registerMachineRoutes } from "./modules/machines/machines.router.js";
import { registerAssemblyRoutes } from "./modules/assemblies/assemblies.router.js";
import { registerRecommendationRoutes } from "./modules/recommendations/recommendations.router.js";
import { registerRecipeRoutes } from "./modules/recipes/recipes.router.js";
import { registerCutLogRoutes } from "./modules/cut-logs/cut-logs.router.js";
import { registerLadderRoutes } from "./modules/ladders/ladders.router.js";
import { registerShopExportRoutes } from "./modules/shop-export/shop-export.router.js";
import { registerVibrationRoutes } from "./modules/vibration/vibration.routes.js";
import { registerAuditRoutes } from "./modules/audit/audit.router.js";
import { LocalDirectoryStorage } from "./storage/local-directory-storage.js";

export function createShopScopedRouter(config: AppConfig = readConfig()): Router {
  const router = Router({ mergeParams: true });
  registerShopRoutes(router);
  registerMemberRoutes(router);
  registerInvitationRoutes(router, config);
  registerBillingRoutes(router, config);
  registerMaterialRoutes(router);
  registerCutterRoutes(router);
  registerMachineRoutes(router);
  registerAssemblyRoutes(router);
  registerRecommendationRoutes(router);
  registerRecipeRoutes(router);
  registerCutLogRoutes(router, { storage: new LocalDirectoryStorage(config.storageDir), photoMaxBytes: config.photoMaxBytes });
  registerLadderRoutes(router);
  registerShopExportRoutes(router);
  registerVibrationRoutes(router, { storageDir: config.storageDir });
  registerAuditRoutes(router);
  return router;
}

export interface RouteEntry {
  method: string;
  /** Path relative to the router, e.g. "/" or "/members/:memberId". */
  path: string;
}

interface StackLayer {
  route?: { path: string; methods: Record<string, boolean> };
}

/**
 * Every route registered on `router`, read from its stack. Throws if the router holds anything
 * other than routes (a nested router would hide its routes from this list).
 */
export function listRoutes(router: Router): RouteEntry[] {
  const entries: RouteEntry[] = [];
  for (const layer of router.stack as StackLayer[]) {
    if (!layer.route) throw new Error("the shop-scoped router must hold routes only (no router.use)");
    for (const [method, on] of Object.entries(layer.route.methods)) {
      if (on && method !== "_all") entries.push({ method: method.toUpperCase(), path: layer.route.path });
    }
  }
  return entries;
}
