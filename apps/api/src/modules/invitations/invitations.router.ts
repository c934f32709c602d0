import { Router } from "express";
import {
  acceptInvitationBodySchema,
  createInvitationBodySchema,
  invitationParamsSchema,
  linkTokenParamsSchema,
} from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { currentShop, currentUser } from "../../http/locals.js";
import { createLimiter } from "../../http/rate-limit.js";
import { inputOf, validate } from "../../http/validate.js";
import { optionalSessionUser } from "../auth/optional-session.js";
import { setSessionCookie } from "../auth/session-cookie.js";
import { signSessionToken } from "../auth/session-token.js";
import { createMailer } from "../mail/mailer.js";
import { getMe } from "../me/me.service.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { auditIp, requestActor } from "../audit/audit-actor.js";
import {
  acceptInvitation,
  invite,
  listInvitations,
  previewInvitation,
  resendInvitation,
  withdrawInvitation,
} from "./invitations.service.js";

const createInput = { body: createInvitationBodySchema };
const idInput = { params: invitationParamsSchema };
const tokenInput = { params: linkTokenParamsSchema };
const acceptInput = { params: linkTokenParamsSchema, body: acceptInvitationBodySchema };

export interface InvitationRouteOptions {
  rateLimitPrefix?: string;
}

/** Shop-scoped, owners only: /invitations. */
export function registerInvitationRoutes(router: Router, config: AppConfig, options: InvitationRouteOptions = {}): void {
  const owner = requireShopRole("owner");
  const deps = { config, mailer: createMailer(config.mail) };
  const perShop = createLimiter(
    {
      name: "invitations-shop",
      rule: config.teamRateLimits.invitationsPerShop,
      what: "invitations sent from this shop",
      key: (_req, res) => res.locals.shop?.id,
    },
    options.rateLimitPrefix,
  );

  router.get("/invitations", owner, async (_req, res) => {
    res.json({ items: await listInvitations(currentShop(res).shop.id) });
  });

  router.post("/invitations", owner, validate(createInput), perShop, async (req, res) => {
    const { body } = inputOf(res, createInput);
    const user = currentUser(res);
    res.status(201).json(await invite(currentShop(res).shop.id, { id: user.id, name: user.name, ip: auditIp(req.ip) }, body, deps));
  });

  router.post("/invitations/:invitationId/resend", owner, validate(idInput), perShop, async (req, res) => {
    const { params } = inputOf(res, idInput);
    const user = currentUser(res);
    res.status(201).json(await resendInvitation(currentShop(res).shop.id, params.invitationId, { id: user.id, name: user.name, ip: auditIp(req.ip) }, deps));
  });

  router.delete("/invitations/:invitationId", owner, validate(idInput), async (_req, res) => {
    const { params } = inputOf(res, idInput);
    await withdrawInvitation(currentShop(res).shop.id, params.invitationId, requestActor(res));
    res.status(204).end();
  });
}

/** Public: /api/invitations/:token — view and accept. */
export function createPublicInvitationRouter(config: AppConfig, options: InvitationRouteOptions = {}): Router {
  const router = Router();
  const acceptPerIp = createLimiter(
    { name: "invitation-accept-ip", rule: config.teamRateLimits.invitationAcceptPerIp, what: "invitation attempts from this network" },
    options.rateLimitPrefix,
  );

  router.get("/:token", validate(tokenInput), async (_req, res) => {
    const { params } = inputOf(res, tokenInput);
    res.json(await previewInvitation(params.token));
  });

  router.post("/:token", acceptPerIp, validate(acceptInput), async (req, res) => {
    const { params, body } = inputOf(res, acceptInput);
    const signedIn = await optionalSessionUser(req, config);
    const accepted = await acceptInvitation(params.token, body, signedIn, auditIp(req.ip));
    if (accepted.created) {
      setSessionCookie(res, config, signSessionToken({ id: accepted.userId, sessionVersion: accepted.sessionVersion }, config.jwtSecret, config.sessionTtlHours));
    }
    res.status(accepted.created ? 201 : 200).json(await getMe(accepted.userId));
  });

  return router;
}
