/// <reference types="vitest/config" />
import { defineConfig, defaultServerConditions } from "vite";

export default defineConfig({
  // Workspace packages export TypeScript source under the "source" condition.
  ssr: { resolve: { conditions: ["source", ...defaultServerConditions] } },
  test: {
    environment: "node",
    include: ["src/**/*.test.ts"],
    globalSetup: ["./src/test/global-setup.ts"],
    // Files run in parallel forks against one database; tests never share rows (unique e-mails,
    // their own shops, their own rate-limit counters).
    pool: "forks",
    maxWorkers: 2,
    testTimeout: 20_000,
    hookTimeout: 30_000,
  },
});
