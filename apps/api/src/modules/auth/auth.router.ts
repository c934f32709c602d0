import { Router } from "express";
import { loginBodySchema, signupBodySchema } from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { createLimiter } from "../../http/rate-limit.js";
import { inputOf, validate } from "../../http/validate.js";
import { getMe } from "../me/me.service.js";
import { auditIp } from "../audit/audit-actor.js";
import { logIn, logOut, signUp } from "./auth.service.js";
import { clearSessionCookie, readSessionCookie, setSessionCookie } from "./session-cookie.js";
import { signSessionToken, verifySessionToken, type SessionClaims } from "./session-token.js";

const signupInput = { body: signupBodySchema };
const loginInput = { body: loginBodySchema };

export interface AuthRouterOptions {
  /** Prefix of this app's rate-limit counters (tests isolate their counters with it). */
  rateLimitPrefix?: string;
}

/** An invalid or expired token needs no revoking. */
function tryVerify(token: string, secret: string): SessionClaims | undefined {
  try {
    return verifySessionToken(token, secret);
  } catch {
    return undefined;
  }
}

export function createAuthRouter(config: AppConfig, options: AuthRouterOptions = {}): Router {
  const router = Router();
  const prefix = options.rateLimitPrefix ?? "rl:";

  const signupPerIp = createLimiter({ name: "signup-ip", rule: config.rateLimits.signupPerIp, what: "sign-ups from this network" }, prefix);
  const loginPerIp = createLimiter(
    { name: "login-ip", rule: config.rateLimits.loginPerIp, what: "failed sign-in attempts from this network", failuresOnly: true },
    prefix,
  );
  const loginPerAccount = createLimiter(
    {
      name: "login-account",
      rule: config.rateLimits.loginPerAccount,
      what: "failed sign-in attempts for this account",
      failuresOnly: true,
      // Runs after validate(), so the address is already normalised (trimmed, lower-case).
      key: (_req, res) => inputOf(res, loginInput).body.email,
    },
    prefix,
  );

  router.post("/signup", signupPerIp, validate(signupInput), async (req, res) => {
    const { body } = inputOf(res, signupInput);
    const user = await signUp(body, auditIp(req.ip));
    setSessionCookie(res, config, signSessionToken(user, config.jwtSecret, config.sessionTtlHours));
    res.status(201).json(await getMe(user.id));
  });

  router.post("/login", loginPerIp, validate(loginInput), loginPerAccount, async (_req, res) => {
    const { body } = inputOf(res, loginInput);
    const user = await logIn(body);
    setSessionCookie(res, config, signSessionToken(user, config.jwtSecret, config.sessionTtlHours));
    res.status(200).json(await getMe(user.id));
  });

  // Always succeeds: signing out without a (valid) session simply clears the cookie.
  router.post("/logout", async (req, res) => {
    const token = readSessionCookie(req);
    const claims = token ? tryVerify(token, config.jwtSecret) : undefined;
    if (claims) await logOut(claims);
    clearSessionCookie(res, config);
    res.status(204).end();
  });

  return router;
}
