import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["src/**/*.test.ts"],
    environment: "node",
    // The engine keeps no state between calls except memo caches, so test files can share a
    // worker's module cache (mathjs, the heaviest oracle, then loads once per worker).
    isolate: false,
    testTimeout: 30000,
  },
});
