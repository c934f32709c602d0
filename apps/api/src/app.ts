import cookieParser from "cookie-parser";
import express, { Router, type Express } from "express";
import type { AppConfig } from "./config/env.js";
import { rejectCrossSite } from "./http/cross-site.js";
import { apiNotFound, errorMiddleware } from "./http/error-middleware.js";
import { requireJsonBody } from "./http/json-body.js";
import { requestId } from "./http/request-id.js";
import { securityHeaders } from "./http/security-headers.js";
import { createWebAppRouter } from "./http/web-app.js";
import { createAuthRouter } from "./modules/auth/auth.router.js";
import { requireSession } from "./modules/auth/require-session.js";
import { createHealthRouter } from "./modules/health/health.router.js";
import { createMeRouter } from "./modules/me/me.router.js";
import { requireShopRole } from "./modules/shops/require-shop-role.js";
import { createShopsRouter } from "./modules/shops/shops.router.js";
import { createShopScopedRouter } from "./routes.js";
import { createBillingWebhookRouter, requireWritableShop } from "./modules/billing/billing.router.js";
import { createPublicInvitationRouter } from "./modules/invitations/invitations.router.js";
import { createDevMailRouter } from "./modules/mail/dev-mail.router.js";
import { createPasswordResetRouter } from "./modules/password-reset/password-reset.router.js";

export interface AppOptions {
  /** Prefix of this app's rate-limit counters in the shared table (tests isolate theirs). */
  rateLimitPrefix?: string;
}

/**
 * Builds the Express app: `/api/*` plus the built web app. No `listen` here, so tests drive it
 * with supertest. The database must be connected first (`connectDatabase`).
 */
export function createApp(config: AppConfig, options: AppOptions = {}): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", config.trustProxy);
  app.set("query parser", "simple");

  app.use(requestId);
  app.use(securityHeaders(config.isProduction));

  const api = Router();
  api.use((_req, res, next) => {
    res.setHeader("Cache-Control", "no-store");
    next();
  });
  api.use(rejectCrossSite(config.appOrigin));
  // The payment provider's webhook is verified over its raw bytes: before the JSON parser.
  api.use("/billing/webhook", createBillingWebhookRouter(config));
  api.use(requireJsonBody);
  api.use(express.json({ limit: "1mb", strict: true }));
  api.use(cookieParser());

  const session = requireSession(config);
  api.use("/health", createHealthRouter());
  const limits = options.rateLimitPrefix ? { rateLimitPrefix: options.rateLimitPrefix } : {};
  api.use("/auth/password-reset", createPasswordResetRouter(config, limits));
  api.use("/invitations", createPublicInvitationRouter(config, limits));
  if (!config.isProduction && config.mail.captureDir) api.use("/dev/mail", createDevMailRouter(config.mail.captureDir));
  api.use("/auth", createAuthRouter(config, options.rateLimitPrefix ? { rateLimitPrefix: options.rateLimitPrefix } : {}));
  api.use("/me", session, createMeRouter());
  // Shop-scoped first: every /api/shops/:shopId/... request passes the membership check.
  api.use("/shops/:shopId", requireSession(config, { withShopMembership: true }), requireShopRole("operator"), requireWritableShop, createShopScopedRouter(config));
  api.use("/shops", session, createShopsRouter());
  api.use(apiNotFound);

  app.use("/api", api);
  app.use(createWebAppRouter(config.webDist));
  app.use(errorMiddleware);
  return app;
}
