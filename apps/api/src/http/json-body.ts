import type { RequestHandler } from "express";
import { AppError } from "./app-error.js";

/**
 * A request carrying a body must send it as JSON, or as multipart/form-data for the few routes
 * that take a file upload (those routes parse it themselves with multer; anywhere else a multipart
 * body is simply not read, so the route's own validation answers). Anything else gets a clear 415.
 */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  const hasBody = req.get("transfer-encoding") !== undefined || Number(req.get("content-length") ?? 0) > 0;
  if (hasBody && !req.is(["application/json", "multipart/form-data"])) {
    throw new AppError(
      "unsupported_media_type",
      "Send the request body as JSON (Content-Type: application/json), or a file upload as multipart/form-data.",
    );
  }
  next();
};
