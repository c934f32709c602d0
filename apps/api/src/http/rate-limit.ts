import type { Request, RequestHandler, Response } from "express";
import { rateLimit } from "express-rate-limit";
import type { RateLimitRule } from "../config/env.js";
import { getSequelize } from "../db/sequelize.js";
import { AppError } from "./app-error.js";
import { PostgresRateLimitStore } from "./rate-limit-store.js";

export interface LimiterOptions {
  /** Distinguishes this limiter's counters from the others' (e.g. "login-ip"). */
  name: string;
  rule: RateLimitRule;
  /** What the person was trying to do, e.g. "sign-in attempts". */
  what: string;
  /** Key per client; defaults to the client IP (IPv6 grouped by /56). */
  key?: (req: Request, res: Response) => string | undefined;
  /** Count only failed requests (status ≥ 400). */
  failuresOnly?: boolean;
}

function waitText(resetTime: Date | undefined, windowMs: number): { seconds: number; text: string } {
  const ms = resetTime ? Math.max(0, resetTime.getTime() - Date.now()) : windowMs;
  const seconds = Math.max(1, Math.ceil(ms / 1000));
  const minutes = Math.ceil(seconds / 60);
  const text = seconds < 60 ? `${seconds} seconds` : minutes === 1 ? "1 minute" : `${minutes} minutes`;
  return { seconds, text };
}

/** A rate limiter whose counters live in PostgreSQL and whose 429 uses the error envelope. */
export function createLimiter(options: LimiterOptions, prefix = "rl:"): RequestHandler {
  const { key } = options;
  return rateLimit({
    windowMs: options.rule.windowMs,
    limit: options.rule.limit,
    standardHeaders: "draft-7",
    legacyHeaders: false,
    skipSuccessfulRequests: options.failuresOnly ?? false,
    store: new PostgresRateLimitStore(getSequelize(), `${prefix}${options.name}:`),
    ...(key
      ? {
          keyGenerator: (req: Request, res: Response) => key(req, res) ?? "unknown",
          skip: (req: Request, res: Response) => key(req, res) === undefined,
        }
      : {}),
    // Let the error middleware log store failures and answer with the envelope.
    passOnStoreError: false,
    handler: (req, _res, next) => {
      const info = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit;
      const wait = waitText(info?.resetTime, options.rule.windowMs);
      next(
        new AppError("rate_limited", `Too many ${options.what}. Try again in ${wait.text}.`, {
          retryAfterSeconds: wait.seconds,
        }),
      );
    },
  });
}
