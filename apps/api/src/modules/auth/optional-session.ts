import type { Request } from "express";
import type { AppConfig } from "../../config/env.js";
import type { SessionUser } from "../../http/locals.js";
import { resolveSession } from "./auth.service.js";
import { readSessionCookie } from "./session-cookie.js";
import { verifySessionToken } from "./session-token.js";

/** The signed-in person on a public route, or null (no cookie, or one that no longer works). */
export async function optionalSessionUser(req: Request, config: AppConfig): Promise<SessionUser | null> {
  const token = readSessionCookie(req);
  if (!token) return null;
  try {
    return (await resolveSession(verifySessionToken(token, config.jwtSecret))).user;
  } catch {
    return null;
  }
}
