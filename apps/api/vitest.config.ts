/// <reference types="vitest/config" />
import { fileURLToPath } from "node:url";
import { defineConfig, defaultServerConditions } from "vite";

export default defineConfig({
  // Workspace packages export TypeScript source under the "source" condition.
  // The global setup runs outside the test environments and ignores the ssr conditions; on a fresh
  // clone no package has been built to dist yet, so point it at the workspace sources directly.
  resolve: {
    alias: {
      "@ringdown/contracts": fileURLToPath(new URL("../../packages/contracts/src/index.ts", import.meta.url)),
      "@ringdown/machining": fileURLToPath(new URL("../../packages/machining/src/index.ts", import.meta.url)),
    },
  },
  ssr: { resolve: { conditions: ["source", ...defaultServerConditions] } },
  test: {
    environment: "node",
    include: ["src/**/*.test.ts"],
    globalSetup: ["./src/test/global-setup.ts"],
    // Files run in two forks against one database; tests never share rows (unique e-mails, their
    // own shops, their own rate-limit counters). Each file connects in its own beforeAll-time code
    // and disconnects in afterAll, so a fork can run its files one after another without
    // re-importing Sequelize, Express and the contracts for every file (isolate: false).
    pool: "forks",
    maxWorkers: 2,
    isolate: false,
    // Generous: bcrypt at cost 12 is slow by design, and CI machines may be busy.
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
