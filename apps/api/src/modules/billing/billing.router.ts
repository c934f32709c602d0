import express, { Router, type RequestHandler } from "express";
import { changeSeatsBodySchema, checkoutBodySchema, confirmCheckoutBodySchema } from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { AppError } from "../../http/app-error.js";
import { currentShop, currentUser } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import {
  changeSeats,
  confirmCheckout,
  getBillingStatus,
  getPlan,
  handleWebhookEvent,
  readOnlyReasonFor,
  setCancelAtPeriodEnd,
  startCheckout,
} from "./billing.service.js";
import { paymentProvider } from "./payment-provider.js";
import { requestActor } from "../audit/audit-actor.js";

const checkoutInput = { body: checkoutBodySchema };
const confirmInput = { body: confirmCheckoutBodySchema };
const seatsInput = { body: changeSeatsBodySchema };

/** Shop-scoped: /plan for every member, /billing/* for owners only. */
export function registerBillingRoutes(router: Router, config: AppConfig): void {
  const owner = requireShopRole("owner");

  router.get("/plan", async (_req, res) => {
    res.json(await getPlan(currentShop(res).shop.id));
  });

  router.get("/billing", owner, async (_req, res) => {
    res.json(await getBillingStatus(currentShop(res).shop.id, config));
  });

  router.post("/billing/checkout", owner, validate(checkoutInput), async (_req, res) => {
    const { body } = inputOf(res, checkoutInput);
    const user = currentUser(res);
    res.status(201).json(await startCheckout(currentShop(res).shop.id, { name: user.name, email: user.email, actor: requestActor(res) }, body.seats, config));
  });

  router.post("/billing/checkout/confirm", owner, validate(confirmInput), async (_req, res) => {
    const { body } = inputOf(res, confirmInput);
    res.json(await confirmCheckout(currentShop(res).shop.id, body.sessionId, config, requestActor(res)));
  });

  router.post("/billing/seats", owner, validate(seatsInput), async (_req, res) => {
    const { body } = inputOf(res, seatsInput);
    res.json(await changeSeats(currentShop(res).shop.id, body.seats, config, requestActor(res)));
  });

  router.post("/billing/cancel", owner, async (_req, res) => {
    res.json(await setCancelAtPeriodEnd(currentShop(res).shop.id, true, config, requestActor(res)));
  });

  router.post("/billing/resume", owner, async (_req, res) => {
    res.json(await setCancelAtPeriodEnd(currentShop(res).shop.id, false, config, requestActor(res)));
  });
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * In the shop-scoped chain, after the membership check: when a lapsed team plan made the shop
 * read-only, every change by anyone but an owner is refused (reading goes on; nothing is lost).
 */
export const requireWritableShop: RequestHandler = async (req, res, next) => {
  if (SAFE_METHODS.has(req.method)) {
    next();
    return;
  }
  const { shop, membership } = currentShop(res);
  const reason = await readOnlyReasonFor(shop.id, membership.role);
  if (reason) throw AppError.forbidden(`This shop is read-only for now. ${reason}`);
  next();
};

/**
 * POST /api/billing/webhook — the provider's events. Mounted before the JSON body parser: the
 * signature is computed over the raw bytes. 400 on a bad signature; 200 for every verified event
 * (a replay answers `duplicate: true` and changes nothing); 5xx makes the provider retry.
 */
export function createBillingWebhookRouter(config: AppConfig): Router {
  const router = Router();
  router.post("/", express.raw({ type: () => true, limit: "1mb" }), async (req, res) => {
    const provider = paymentProvider(config.billing);
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const event = provider.verifyWebhook(body, req.get("stripe-signature"));
    const { duplicate } = await handleWebhookEvent(event, config);
    res.json({ received: true, duplicate });
  });
  return router;
}
