import { createRequire } from "node:module";

// apps/api/package.json sits one level above both src/ and dist/.
const pkg = createRequire(import.meta.url)("../package.json") as { version: string };

/** The API's version, as published by GET /api/health. */
export const apiVersion: string = pkg.version;
