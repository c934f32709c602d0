import type { RequestHandler } from "express";
import { AppError } from "./app-error.js";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Refuses state-changing requests sent from another site (cross-site request forgery).
 * The SameSite=Lax cookie already keeps the session off most cross-site requests; this adds a
 * check of the browser's own provenance headers when they are present:
 *  - `Sec-Fetch-Site` must be "same-origin" or "none" (typed by the user);
 *  - `Origin` must be the app's origin or this request's own origin.
 * Requests without either header (curl, server-to-server) carry no ambient browser cookie risk.
 */
export function rejectCrossSite(appOrigin: string): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) {
      next();
      return;
    }
    const fetchSite = req.get("sec-fetch-site");
    if (fetchSite && fetchSite !== "same-origin" && fetchSite !== "none") {
      throw AppError.forbidden("Cross-site requests are not accepted.");
    }
    const origin = req.get("origin");
    if (origin !== undefined) {
      const ownOrigin = `${req.protocol}://${req.get("host") ?? ""}`;
      if (origin !== appOrigin && origin !== ownOrigin) {
        throw AppError.forbidden("Cross-site requests are not accepted.");
      }
    }
    next();
  };
}
