import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { apiErrorSchema, meSchema } from "@ringdown/contracts";
import { createApp } from "../../app.js";
import {
  connectTestDatabase,
  disconnectTestDatabase,
  createPerson,
  testConfig,
  TEST_PASSWORD,
  uniqueEmail,
} from "../../test/harness.js";

afterAll(disconnectTestDatabase);

const window = 15 * 60_000;
const roomy = { limit: 10_000, windowMs: window };

/**
 * Apps with small limits, behind one trusted proxy so each test can use its own client address
 * (X-Forwarded-For). The counters live in PostgreSQL under the given prefix.
 */
function limitedApp(limits: { loginPerIp?: number; loginPerAccount?: number; signupPerIp?: number }, prefix: string) {
  connectTestDatabase();
  return createApp(
    testConfig({
      trustProxy: 1,
      rateLimits: {
        loginPerIp: limits.loginPerIp ? { limit: limits.loginPerIp, windowMs: window } : roomy,
        loginPerAccount: limits.loginPerAccount ? { limit: limits.loginPerAccount, windowMs: window } : roomy,
        signupPerIp: limits.signupPerIp ? { limit: limits.signupPerIp, windowMs: 60 * 60_000 } : roomy,
      },
    }),
    { rateLimitPrefix: prefix },
  );
}

const fakeIp = () => `203.0.113.${Math.floor(Math.random() * 250) + 1}`;
const prefix = () => `rl-test-${randomUUID()}:`;

describe("sign-in rate limits", () => {
  it("limits failed attempts per account with a clear 429, across client addresses", async () => {
    const app = limitedApp({ loginPerAccount: 3 }, prefix());
    const { email } = await createPerson(app, "victim");
    for (let i = 0; i < 3; i++) {
      const res = await request(app).post("/api/auth/login").set("X-Forwarded-For", fakeIp()).send({ email, password: "wrong password" });
      expect(res.status).toBe(401);
    }
    // Fourth attempt, even with the right password and from another address: refused.
    const res = await request(app).post("/api/auth/login").set("X-Forwarded-For", fakeIp()).send({ email, password: TEST_PASSWORD });
    expect(res.status).toBe(429);
    const error = apiErrorSchema.parse(res.body).error;
    expect(error.code).toBe("rate_limited");
    expect(error.message).toBe("Too many failed sign-in attempts for this account. Try again in 15 minutes.");
    expect(Number(res.headers["retry-after"])).toBeGreaterThan(0);
    expect(Number(res.headers["retry-after"])).toBeLessThanOrEqual(900);

    // Another account is not affected.
    const other = await createPerson(app, "bystander");
    const ok = await request(app).post("/api/auth/login").send({ email: other.email, password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
  });

  it("does not count successful sign-ins against the account", async () => {
    const app = limitedApp({ loginPerAccount: 2 }, prefix());
    const { email } = await createPerson(app, "regular");
    for (let i = 0; i < 4; i++) {
      const res = await request(app).post("/api/auth/login").send({ email, password: TEST_PASSWORD });
      expect(res.status).toBe(200);
    }
  });

  it("limits failed attempts per client address, whatever the account", async () => {
    const app = limitedApp({ loginPerIp: 2 }, prefix());
    const ip = fakeIp();
    for (let i = 0; i < 2; i++) {
      const res = await request(app).post("/api/auth/login").set("X-Forwarded-For", ip).send({ email: uniqueEmail("spray"), password: "guess-guess" });
      expect(res.status).toBe(401);
    }
    const blocked = await request(app).post("/api/auth/login").set("X-Forwarded-For", ip).send({ email: uniqueEmail("spray"), password: "guess-guess" });
    expect(blocked.status).toBe(429);
    expect(apiErrorSchema.parse(blocked.body).error.message).toBe(
      "Too many failed sign-in attempts from this network. Try again in 15 minutes.",
    );
    const elsewhere = await request(app).post("/api/auth/login").set("X-Forwarded-For", "198.51.100.7").send({ email: uniqueEmail("spray"), password: "guess-guess" });
    expect(elsewhere.status).toBe(401);
  });

  it("keeps its counters in PostgreSQL, shared by every API instance", async () => {
    const shared = prefix();
    const instanceA = limitedApp({ loginPerAccount: 2 }, shared);
    const instanceB = limitedApp({ loginPerAccount: 2 }, shared);
    const { email } = await createPerson(instanceA, "shared");
    expect((await request(instanceA).post("/api/auth/login").send({ email, password: "wrong one!" })).status).toBe(401);
    expect((await request(instanceB).post("/api/auth/login").send({ email, password: "wrong two!" })).status).toBe(401);
    expect((await request(instanceA).post("/api/auth/login").send({ email, password: TEST_PASSWORD })).status).toBe(429);
  });
});

describe("sign-up rate limit", () => {
  it("limits sign-ups per client address", async () => {
    const app = limitedApp({ signupPerIp: 1 }, prefix());
    const ip = fakeIp();
    const body = () => ({ email: uniqueEmail("burst"), password: TEST_PASSWORD, name: "Burst", shopName: "Burst shop" });
    const first = await request(app).post("/api/auth/signup").set("X-Forwarded-For", ip).send(body());
    expect(first.status).toBe(201);
    meSchema.parse(first.body);
    const second = await request(app).post("/api/auth/signup").set("X-Forwarded-For", ip).send(body());
    expect(second.status).toBe(429);
    expect(apiErrorSchema.parse(second.body).error.message).toBe(
      "Too many sign-ups from this network. Try again in 60 minutes.",
    );
  });
});
