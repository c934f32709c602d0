import { defineConfig, devices } from "@playwright/test";
import { fileURLToPath } from "node:url";

/**
 * End-to-end tests: the built app served by the API (one Express process, as in production)
 * on its own port and database, driven by Debian's Chromium (no browser download).
 * Build first (`npm run build -w @ringdown/api && npm run build -w @ringdown/web`);
 * `npm test` does this, and gives the server a fresh `ringdown_e2e` database.
 */
const repoRoot = fileURLToPath(new URL("..", import.meta.url));
const port = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://localhost:${port}`;
const testPgPort = process.env.RINGDOWN_PG_TEST_PORT ?? "5434";
const databaseUrl = process.env.E2E_DATABASE_URL ?? `postgres://postgres@127.0.0.1:${testPgPort}/ringdown_e2e`;
// Local stand-ins for the hosted services: SMTP capture and the payment-provider fake, on loopback.
const smtpPort = Number(process.env.E2E_SMTP_PORT ?? 2526);
const paymentsPort = Number(process.env.E2E_PAYMENTS_PORT ?? 12112);
const mailDir = fileURLToPath(new URL(`../.data/mail-capture/e2e-${port}`, import.meta.url));
const devServices = fileURLToPath(new URL("../apps/api/dist/dev-services", import.meta.url));

const chromium = {
  executablePath: process.env.RINGDOWN_CHROMIUM ?? "/usr/bin/chromium",
  args: [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--disable-dev-shm-usage",
  ],
};

export default defineConfig({
  testDir: "./e2e",
  outputDir: "./test-results",
  fullyParallel: true,
  workers: 2,
  forbidOnly: Boolean(process.env.CI),
  retries: 0,
  // Generous: CI runners share two cores between the server, PostgreSQL and two browsers.
  timeout: 90_000,
  expect: { timeout: 15_000 },
  reporter: process.env.CI ? [["list"], ["json"]] : [["list"]],
  use: {
    baseURL,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: chromium,
  },
  projects: [
    { name: "desktop", use: { ...devices["Desktop Chrome"], launchOptions: chromium }, testIgnore: /\.phone\.spec\.ts$/ },
    {
      name: "phone",
      use: {
        defaultBrowserType: "chromium",
        viewport: { width: 375, height: 740 },
        deviceScaleFactor: 2,
        isMobile: true,
        hasTouch: true,
        launchOptions: chromium,
      },
      testMatch: /\.phone\.spec\.ts$/,
    },
  ],
  webServer: [
    {
      command: `node ${devServices}/mail-capture/main.js --port ${smtpPort} --dir ${mailDir}`,
      port: smtpPort,
      reuseExistingServer: !process.env.CI,
      timeout: 20_000,
      stdout: "ignore",
      stderr: "pipe",
    },
    {
      command: `node ${devServices}/payment-provider-fake/main.js --port ${paymentsPort} --webhook-url ${baseURL}/api/billing/webhook`,
      url: `http://127.0.0.1:${paymentsPort}/_fake/health`,
      reuseExistingServer: !process.env.CI,
      timeout: 20_000,
      stdout: "ignore",
      stderr: "pipe",
    },
    {
      command: "npm run serve -w @ringdown/api",
      cwd: repoRoot,
      url: `${baseURL}/api/health`,
      reuseExistingServer: !process.env.CI,
      timeout: 60_000,
      stdout: "ignore",
      stderr: "pipe",
      env: {
        PORT: String(port),
        DATABASE_URL: databaseUrl,
        SEED_DEMO: "true",
        WEB_DIST: process.env.E2E_WEB_DIST ?? fileURLToPath(new URL("../apps/web/dist", import.meta.url)),
        APP_URL: baseURL,
        SMTP_HOST: "127.0.0.1",
        SMTP_PORT: String(smtpPort),
        MAIL_CAPTURE_DIR: mailDir,
        STRIPE_API_URL: `http://127.0.0.1:${paymentsPort}`,
      },
    },
  ],
});
