import { Router } from "express";
import { linkTokenParamsSchema, passwordResetBodySchema, passwordResetRequestBodySchema } from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { createLimiter } from "../../http/rate-limit.js";
import { inputOf, validate } from "../../http/validate.js";
import { setSessionCookie } from "../auth/session-cookie.js";
import { signSessionToken } from "../auth/session-token.js";
import { createMailer } from "../mail/mailer.js";
import { getMe } from "../me/me.service.js";
import { describeResetLink, requestPasswordReset, resetPassword } from "./password-reset.service.js";

const requestInput = { body: passwordResetRequestBodySchema };
const tokenInput = { params: linkTokenParamsSchema };
const resetInput = { params: linkTokenParamsSchema, body: passwordResetBodySchema };

/** Public: /api/auth/password-reset. */
export function createPasswordResetRouter(config: AppConfig, options: { rateLimitPrefix?: string } = {}): Router {
  const router = Router();
  const mailer = createMailer(config.mail);
  const perIp = createLimiter(
    { name: "password-reset-ip", rule: config.teamRateLimits.passwordResetPerIp, what: "password-reset requests from this network" },
    options.rateLimitPrefix,
  );
  const perAccount = createLimiter(
    {
      name: "password-reset-account",
      rule: config.teamRateLimits.passwordResetPerAccount,
      what: "password-reset requests for this address",
      key: (_req, res) => inputOf(res, requestInput).body.email,
    },
    options.rateLimitPrefix,
  );

  // Always 202 with the same words: whether the address has an account is not revealed.
  router.post("/", perIp, validate(requestInput), perAccount, async (_req, res) => {
    const { body } = inputOf(res, requestInput);
    await requestPasswordReset(body.email, { config, mailer });
    res.status(202).json({
      message: "If an account uses this address, a link to choose a new password is on its way. It works for 1 hour.",
    });
  });

  router.get("/:token", validate(tokenInput), async (_req, res) => {
    const { params } = inputOf(res, tokenInput);
    res.json(await describeResetLink(params.token));
  });

  router.post("/:token", perIp, validate(resetInput), async (_req, res) => {
    const { params, body } = inputOf(res, resetInput);
    const user = await resetPassword(params.token, body.password);
    setSessionCookie(res, config, signSessionToken(user, config.jwtSecret, config.sessionTtlHours));
    res.json(await getMe(user.id));
  });

  return router;
}
