import type { RequestHandler } from "express";
import { AppError } from "./app-error.js";

/** A request carrying a body must send it as JSON; anything else gets a clear 415. */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  const hasBody = req.get("transfer-encoding") !== undefined || Number(req.get("content-length") ?? 0) > 0;
  if (hasBody && !req.is("application/json")) {
    throw new AppError("unsupported_media_type", "Send the request body as JSON (Content-Type: application/json).");
  }
  next();
};
