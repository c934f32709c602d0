import { existsSync } from "node:fs";
import path from "node:path";
import express, { Router } from "express";

/**
 * Serves the built web app from `webDist` with a single-page-app fallback: any GET that is not an
 * API call and not a file gets index.html, so deep links work. Hashed assets are cached for a
 * year; index.html is revalidated every time so a new release shows at once.
 */
export function createWebAppRouter(webDist: string): Router {
  const router = Router();
  const indexFile = path.join(webDist, "index.html");

  if (!existsSync(indexFile)) {
    router.use((req, res, next) => {
      if (req.method !== "GET" && req.method !== "HEAD") return next();
      res
        .status(404)
        .type("text/plain")
        .send(`The Ringdown API is running, but the web app has not been built (no ${indexFile}).\n`);
    });
    return router;
  }

  router.use(
    express.static(webDist, {
      index: false,
      setHeaders(res, filePath) {
        const immutable = filePath.startsWith(path.join(webDist, "assets") + path.sep);
        res.setHeader("Cache-Control", immutable ? "public, max-age=31536000, immutable" : "no-cache");
      },
    }),
  );
  router.use((req, res, next) => {
    if (req.method !== "GET" && req.method !== "HEAD") return next();
    res.setHeader("Cache-Control", "no-cache");
    res.sendFile(indexFile);
  });
  return router;
}
