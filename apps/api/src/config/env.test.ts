import path from "node:path";
import { describe, expect, it } from "vitest";
import { ConfigError, parseConfig, repoRoot } from "./env.js";

describe("parseConfig", () => {
  it("gives development defaults: port 3000, the dev cluster, web app from apps/web/dist, no seed", () => {
    const config = parseConfig({});
    expect(config).toMatchObject({
      nodeEnv: "development",
      port: 3000,
      databaseUrl: "postgres://postgres@127.0.0.1:5433/ringdown",
      sessionTtlHours: 12,
      seedDemo: false,
      appOrigin: "http://localhost:3000",
      trustProxy: 0,
      isProduction: false,
    });
    expect(config.webDist).toBe(path.join(repoRoot, "apps/web/dist"));
    expect(config.jwtSecret.length).toBeGreaterThanOrEqual(32);
  });

  it("uses the test cluster's test database by default under NODE_ENV=test", () => {
    expect(parseConfig({ NODE_ENV: "test" }).databaseUrl).toBe("postgres://postgres@127.0.0.1:5434/ringdown_test");
  });

  it("reads every variable", () => {
    const config = parseConfig({
      PORT: "3100",
      DATABASE_URL: "postgres://postgres@127.0.0.1:5434/ringdown_e2e",
      JWT_SECRET: "s".repeat(40),
      SESSION_TTL_HOURS: "1.5",
      WEB_DIST: "/srv/web",
      SEED_DEMO: "true",
      APP_URL: "http://127.0.0.1:3100/",
      TRUST_PROXY: "1",
      LOGIN_MAX_PER_IP: "7",
      LOGIN_MAX_PER_ACCOUNT: "3",
      SIGNUP_MAX_PER_IP: "2",
    });
    expect(config).toMatchObject({
      port: 3100,
      databaseUrl: "postgres://postgres@127.0.0.1:5434/ringdown_e2e",
      jwtSecret: "s".repeat(40),
      sessionTtlHours: 1.5,
      webDist: "/srv/web",
      seedDemo: true,
      appOrigin: "http://127.0.0.1:3100",
      trustProxy: 1,
    });
    expect(config.rateLimits.loginPerIp.limit).toBe(7);
    expect(config.rateLimits.loginPerAccount.limit).toBe(3);
    expect(config.rateLimits.signupPerIp.limit).toBe(2);
  });

  it("follows the local cluster ports for the default database", () => {
    expect(parseConfig({ RINGDOWN_PG_DEV_PORT: "6543" }).databaseUrl).toBe("postgres://postgres@127.0.0.1:6543/ringdown");
    expect(parseConfig({ NODE_ENV: "test", RINGDOWN_PG_TEST_PORT: "6544" }).databaseUrl).toBe(
      "postgres://postgres@127.0.0.1:6544/ringdown_test",
    );
  });

  it("treats empty values as unset", () => {
    expect(parseConfig({ PORT: "", SEED_DEMO: "" })).toMatchObject({ port: 3000, seedDemo: false });
  });

  it("refuses production without a secret, a database and an app URL", () => {
    expect(() => parseConfig({ NODE_ENV: "production" })).toThrow(ConfigError);
    try {
      parseConfig({ NODE_ENV: "production" });
    } catch (error) {
      expect((error as Error).message).toMatch(/JWT_SECRET: is required in production/);
      expect((error as Error).message).toMatch(/DATABASE_URL: is required in production/);
      expect((error as Error).message).toMatch(/APP_URL: is required in production/);
    }
  });

  it("rejects bad values with the variable's name", () => {
    expect(() => parseConfig({ PORT: "eighty" })).toThrow(/PORT/);
    expect(() => parseConfig({ SEED_DEMO: "perhaps" })).toThrow(/SEED_DEMO/);
    expect(() => parseConfig({ JWT_SECRET: "short" })).toThrow(/JWT_SECRET: must be at least 32 characters/);
    expect(() => parseConfig({ DATABASE_URL: "mysql://x" })).toThrow(/DATABASE_URL/);
  });
});
