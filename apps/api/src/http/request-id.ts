import { randomUUID } from "node:crypto";
import type { RequestHandler } from "express";

/** Gives every request an id, returned in `X-Request-Id` and written next to any logged error. */
export const requestId: RequestHandler = (_req, res, next) => {
  const id = randomUUID();
  res.locals.requestId = id;
  res.setHeader("X-Request-Id", id);
  next();
};
