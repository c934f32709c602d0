/// <reference types="vitest/config" />
import { defineConfig, defaultClientConditions } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { fileURLToPath } from "node:url";

// The api serves the built app and `/api/*` from one origin in production;
// in development vite proxies `/api` to the api so cookies stay same-origin.
const apiTarget = process.env.RINGDOWN_API_URL ?? "http://localhost:3000";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  // Some shared numeric dependencies read the Node `global`; without this the
  // built page is blank in a browser while jsdom tests still pass.
  define: { global: "globalThis" },
  resolve: {
    // Workspace packages export TypeScript source under the "source" condition.
    conditions: ["source", ...defaultClientConditions],
    alias: { "@": fileURLToPath(new URL("./src", import.meta.url)) },
  },
  server: {
    port: 5173,
    proxy: { "/api": { target: apiTarget, changeOrigin: false } },
  },
  build: {
    outDir: "dist",
    sourcemap: true,
    // Nothing inline: the server sends a CSP with `script-src 'self'`.
    assetsInlineLimit: 0,
  },
  test: {
    environment: "jsdom",
    setupFiles: ["./src/test/setup.ts"],
    include: ["src/**/*.test.{ts,tsx}"],
    css: false,
  },
});
