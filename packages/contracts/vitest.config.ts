/// <reference types="vitest/config" />
import { defineConfig, defaultServerConditions } from "vite";

export default defineConfig({
  // Workspace packages export TypeScript source under the "source" condition.
  ssr: { resolve: { conditions: ["source", ...defaultServerConditions] } },
  test: { environment: "node", include: ["src/**/*.test.ts"] },
});
