import type { RequestHandler } from "express";
import type { AppConfig } from "../../config/env.js";
import { AppError } from "../../http/app-error.js";
import { resolveSession } from "./auth.service.js";
import { clearSessionCookie, readSessionCookie } from "./session-cookie.js";
import { verifySessionToken } from "./session-token.js";

/** Requires a valid session cookie; leaves the user in `res.locals.user`. 401 otherwise. */
export function requireSession(config: AppConfig): RequestHandler {
  return async (req, res, next) => {
    const token = readSessionCookie(req);
    if (!token) throw AppError.unauthenticated("Sign in to continue.");
    try {
      const claims = verifySessionToken(token, config.jwtSecret);
      res.locals.user = await resolveSession(claims);
      res.locals.session = { tokenId: claims.jti, expiresAt: new Date(claims.exp * 1000) };
    } catch (error) {
      // A cookie that can never work again is removed so the browser stops sending it.
      if (error instanceof AppError && error.code === "unauthenticated") clearSessionCookie(res, config);
      throw error;
    }
    next();
  };
}
