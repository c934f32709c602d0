import type { CookieOptions, Request, Response } from "express";
import type { AppConfig } from "../../config/env.js";
import type { IssuedToken } from "./session-token.js";

export const SESSION_COOKIE = "rd_session";

function baseOptions(config: AppConfig): CookieOptions {
  return { httpOnly: true, sameSite: "lax", secure: config.isProduction, path: "/" };
}

export function setSessionCookie(res: Response, config: AppConfig, issued: IssuedToken): void {
  res.cookie(SESSION_COOKIE, issued.token, { ...baseOptions(config), expires: issued.expiresAt });
}

export function clearSessionCookie(res: Response, config: AppConfig): void {
  res.clearCookie(SESSION_COOKIE, baseOptions(config));
}

export function readSessionCookie(req: Request): string | undefined {
  const value = (req.cookies as Record<string, unknown> | undefined)?.[SESSION_COOKIE];
  return typeof value === "string" && value.length > 0 ? value : undefined;
}
