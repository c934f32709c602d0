import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import express from "express";
import request from "supertest";
import { afterAll, describe, expect, it, vi } from "vitest";
import { apiErrorSchema } from "@ringdown/contracts";
import { UserModel } from "../modules/users/user.model.js";
import { disconnectTestDatabase, makeTestApp, createPerson, TEST_PASSWORD, uniqueEmail } from "../test/harness.js";
import { AppError } from "./app-error.js";
import { errorMiddleware } from "./error-middleware.js";
import { requestId } from "./request-id.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

describe("API fallbacks and headers", () => {
  it("answers unknown /api routes with a 404 envelope, not the web app", async () => {
    const res = await request(app).get("/api/no-such-thing?x=1");
    expect(res.status).toBe(404);
    expect(apiErrorSchema.parse(res.body).error).toEqual({ code: "not_found", message: "No API route GET /api/no-such-thing." });
  });

  it("sends a strict Content-Security-Policy (no inline script) and a request id", async () => {
    const res = await request(app).get("/api/health");
    const csp = res.headers["content-security-policy"] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toContain("unsafe-inline");
    expect(csp).not.toContain("unsafe-eval");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers["x-request-id"]).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.headers["x-powered-by"]).toBeUndefined();
  });

  it("answers 400 (not 500) for a URL with a broken %-escape in a parameter", async () => {
    const person = await createPerson(app, "badurl");
    const res = await person.agent.get("/api/shops/%E0%A4%A/members");
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.code).toBe("validation_failed");
  });

  it("answers 413 for an oversized JSON body", async () => {
    const res = await request(app)
      .post("/api/auth/login")
      .set("Content-Type", "application/json")
      .send(JSON.stringify({ email: "a@b.example", password: "x".repeat(2 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(apiErrorSchema.parse(res.body).error.code).toBe("payload_too_large");
  });
});

describe("cross-site request protection", () => {
  const login = () => ({ email: uniqueEmail("csrf"), password: TEST_PASSWORD });

  it("refuses a state-changing request from another site (Sec-Fetch-Site) with 403", async () => {
    const person = await createPerson(app, "csrf-victim");
    const res = await person.agent.patch("/api/me").set("Sec-Fetch-Site", "cross-site").send({ unitSystem: "imperial" });
    expect(res.status).toBe(403);
    expect(apiErrorSchema.parse(res.body).error).toEqual({ code: "forbidden", message: "Cross-site requests are not accepted." });
  });

  it("refuses a state-changing request whose Origin is another site with 403", async () => {
    const res = await request(app).post("/api/auth/login").set("Origin", "https://evil.example").send(login());
    expect(res.status).toBe(403);
    const nullOrigin = await request(app).post("/api/auth/login").set("Origin", "null").send(login());
    expect(nullOrigin.status).toBe(403);
  });

  it("accepts same-origin requests (app origin or the request's own host) and safe cross-site reads", async () => {
    const fromApp = await request(app)
      .post("/api/auth/login")
      .set("Origin", "http://localhost:3000")
      .set("Sec-Fetch-Site", "same-origin")
      .send(login());
    expect(fromApp.status).toBe(401); // reached the handler: unknown account
    const fromOwnHost = await request(app).post("/api/auth/login").set("Host", "shop.local:8080").set("Origin", "http://shop.local:8080").send(login());
    expect(fromOwnHost.status).toBe(401);
    const read = await request(app).get("/api/health").set("Sec-Fetch-Site", "cross-site").set("Origin", "https://evil.example");
    expect(read.status).toBe(200);
  });
});

describe("error middleware", () => {
  function appThrowing(error: () => unknown) {
    const mini = express();
    mini.use(requestId);
    mini.get("/boom", async () => {
      throw error();
    });
    mini.use(errorMiddleware);
    return mini;
  }

  it("turns an unexpected error into a generic 500 with a reference, logs it, and leaks no stack", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const res = await request(appThrowing(() => new Error("secret internal detail"))).get("/boom");
    expect(res.status).toBe(500);
    const error = apiErrorSchema.parse(res.body).error;
    const id = res.headers["x-request-id"] as string;
    expect(error).toEqual({ code: "internal_error", message: `Something went wrong on our side. Reference: ${id}.` });
    expect(JSON.stringify(res.body)).not.toContain("secret internal detail");
    expect(log).toHaveBeenCalledTimes(1);
    expect(String(log.mock.calls[0]?.[0])).toContain(id);
    expect(String(log.mock.calls[0]?.[0])).toContain("secret internal detail");
    log.mockRestore();
  });

  it("maps a PostgreSQL unique violation to 409 with the column as field", async () => {
    const person = await createPerson(app, "unique");
    let caught: unknown;
    try {
      await UserModel.create({ email: person.email, name: "Copy", passwordHash: "x" });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeDefined();
    const res = await request(appThrowing(() => caught)).get("/boom");
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error).toEqual({
      code: "conflict",
      message: "That already exists.",
      fields: { email: "This value is already in use." },
    });
  });

  it("maps AppError codes to their statuses and passes Retry-After", async () => {
    const res = await request(appThrowing(() => new AppError("rate_limited", "Slow down.", { retryAfterSeconds: 42 }))).get("/boom");
    expect(res.status).toBe(429);
    expect(res.headers["retry-after"]).toBe("42");
    expect(apiErrorSchema.parse(res.body).error).toEqual({ code: "rate_limited", message: "Slow down." });
  });
});

describe("serving the web app", () => {
  const dist = mkdtempSync(path.join(tmpdir(), "ringdown-web-"));
  mkdirSync(path.join(dist, "assets"));
  writeFileSync(path.join(dist, "index.html"), "<!doctype html><title>Ringdown test shell</title>");
  writeFileSync(path.join(dist, "assets", "app-3f2a.js"), "console.log('app');");
  const withWeb = makeTestApp({ webDist: dist });
  afterAll(() => rmSync(dist, { recursive: true, force: true }));

  it("serves files, with long caching for hashed assets", async () => {
    const res = await request(withWeb).get("/assets/app-3f2a.js");
    expect(res.status).toBe(200);
    expect(res.text).toContain("console.log");
    expect(res.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
  });

  it("answers deep links with index.html (revalidated every time)", async () => {
    const res = await request(withWeb).get("/recipes/some-recipe");
    expect(res.status).toBe(200);
    expect(res.text).toContain("Ringdown test shell");
    expect(res.headers["cache-control"]).toBe("no-cache");
  });

  it("keeps /api paths out of the fallback", async () => {
    const res = await request(withWeb).get("/api/recipes");
    expect(res.status).toBe(404);
    expect(apiErrorSchema.parse(res.body).error.code).toBe("not_found");
  });

  it("says plainly when the web app has not been built", async () => {
    const bare = makeTestApp({ webDist: path.join(dist, "missing") });
    const res = await request(bare).get("/");
    expect(res.status).toBe(404);
    expect(res.text).toMatch(/web app has not been built/);
  });
});
