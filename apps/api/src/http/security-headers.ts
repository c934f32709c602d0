import helmet from "helmet";
import type { RequestHandler } from "express";

/**
 * Security headers, with a Content-Security-Policy the built web app runs under: every script,
 * style, font and image comes from our own origin (Vite emits files, no inline script), nothing
 * from the network. `data:` stays allowed for small images and fonts Vite may inline.
 */
export function securityHeaders(isProduction: boolean): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        "default-src": ["'self'"],
        "script-src": ["'self'"],
        "script-src-attr": ["'none'"],
        "style-src": ["'self'"],
        "img-src": ["'self'", "data:", "blob:"],
        "font-src": ["'self'", "data:"],
        "connect-src": ["'self'"],
        "media-src": ["'self'", "blob:"],
        "worker-src": ["'self'", "blob:"],
        "object-src": ["'none'"],
        "base-uri": ["'self'"],
        "form-action": ["'self'"],
        "frame-ancestors": ["'none'"],
        // Only where the app is served over HTTPS; on http://localhost it would break every asset.
        ...(isProduction ? { "upgrade-insecure-requests": [] } : {}),
      },
    },
    // HSTS pins browsers to HTTPS for the host: only meaningful (and safe) in production.
    strictTransportSecurity: isProduction ? { maxAge: 15_552_000, includeSubDomains: true } : false,
    crossOriginEmbedderPolicy: false,
    frameguard: { action: "deny" },
    referrerPolicy: { policy: "same-origin" },
  });
}
