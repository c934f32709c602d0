/**
 * Security headers beyond the Content-Security-Policy (http.test.ts checks that one), the session
 * cookie's flags when signing in, and the rate limits no other file exercises: password-reset
 * requests and invitation answers per client address.
 */
import express from "express";
import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { apiErrorSchema } from "@ringdown/contracts";
import { createPerson, disconnectTestDatabase, makeTestApp, sessionCookieOf, testConfig, TEST_PASSWORD, uniqueEmail } from "../test/harness.js";
import { securityHeaders } from "./security-headers.js";

afterAll(disconnectTestDatabase);

describe("security headers", () => {
  const app = makeTestApp();

  it.each(["/api/health", "/api/no-such-route", "/some/deep/link"])("%s carries the protective headers", async (path) => {
    const res = await request(app).get(path);
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["x-frame-options"]).toBe("DENY");
    expect(res.headers["referrer-policy"]).toBe("same-origin");
    expect(res.headers["cross-origin-opener-policy"]).toBe("same-origin");
    expect(res.headers["cross-origin-resource-policy"]).toBe("same-origin");
    expect(res.headers["x-dns-prefetch-control"]).toBe("off");
    expect(res.headers["x-powered-by"]).toBeUndefined();
    // Outside production (plain http://localhost) no HSTS and no upgrade of insecure requests.
    expect(res.headers["strict-transport-security"]).toBeUndefined();
    const csp = res.headers["content-security-policy"] as string;
    expect(csp).toMatch(/(^|;)script-src 'self'(;|$)/);
    expect(csp).toContain("script-src-attr 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toContain("upgrade-insecure-requests");
  });

  it("API answers are never cached", async () => {
    expect((await request(app).get("/api/health")).headers["cache-control"]).toBe("no-store");
  });

  it("in production adds HSTS and upgrades insecure requests, still with no inline script", async () => {
    const prod = express().use(securityHeaders(true)).get("/", (_req, res) => void res.send("ok"));
    const res = await request(prod).get("/");
    expect(res.headers["strict-transport-security"]).toBe("max-age=15552000; includeSubDomains");
    const csp = res.headers["content-security-policy"] as string;
    expect(csp).toContain("upgrade-insecure-requests");
    expect(csp).not.toContain("unsafe-inline");
    expect(csp).not.toContain("unsafe-eval");
  });
});

describe("the session cookie set by signing in", () => {
  // auth.test.ts checks the flags of the cookie sign-up sets outside production.
  it("is httpOnly, SameSite=Lax and, in production, Secure", async () => {
    const prod = makeTestApp({ isProduction: true });
    const person = await createPerson(prod, "cookie-flags");
    const res = await request(prod).post("/api/auth/login").send({ email: person.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(sessionCookieOf(res.headers["set-cookie"])).toMatch(/^rd_session=.+/);
    const line = ([] as string[]).concat(res.headers["set-cookie"] ?? []).find((c) => c.startsWith("rd_session="));
    expect(line).toMatch(/; HttpOnly/);
    expect(line).toMatch(/; SameSite=Lax/);
    expect(line).toMatch(/; Secure/);
  });
});

describe("rate limits per client address", () => {
  const hour = 60 * 60_000;
  const base = testConfig().teamRateLimits;

  it("limits password-reset requests from one address, whatever the account", async () => {
    const limited = makeTestApp({ trustProxy: 1, teamRateLimits: { ...base, passwordResetPerIp: { limit: 2, windowMs: hour } } });
    const from = (email: string) => request(limited).post("/api/auth/password-reset").set("X-Forwarded-For", "198.51.100.77").send({ email });
    for (let i = 0; i < 2; i++) expect((await from(uniqueEmail(`reset-ip-${i}`))).status).toBe(202);
    const res = await from(uniqueEmail("reset-ip-over"));
    expect(res.status).toBe(429);
    expect(res.headers["retry-after"]).toMatch(/^\d+$/);
    expect(apiErrorSchema.parse(res.body).error).toEqual({
      code: "rate_limited",
      message: "Too many password-reset requests from this network. Try again in 60 minutes.",
    });
    // Another address is not affected.
    expect((await request(limited).post("/api/auth/password-reset").set("X-Forwarded-For", "198.51.100.78").send({ email: uniqueEmail("other") })).status).toBe(202);
  });

  it("limits answers to invitation links from one address (guessing tokens gets nowhere fast)", async () => {
    const limited = makeTestApp({ trustProxy: 1, teamRateLimits: { ...base, invitationAcceptPerIp: { limit: 2, windowMs: hour } } });
    const guess = (token: string) => request(limited).post(`/api/invitations/${token}`).set("X-Forwarded-For", "198.51.100.90").send({});
    for (const token of ["A".repeat(43), "B".repeat(43)]) expect((await guess(token)).status).toBe(404);
    const res = await guess("C".repeat(43));
    expect(res.status).toBe(429);
    expect(apiErrorSchema.parse(res.body).error.code).toBe("rate_limited");
    expect(apiErrorSchema.parse(res.body).error.message).toMatch(/^Too many invitation attempts from this network\. Try again in/);
  });
});
