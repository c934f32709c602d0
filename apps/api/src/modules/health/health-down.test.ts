import request from "supertest";
import { afterAll, describe, expect, it, vi } from "vitest";
import { healthSchema } from "@ringdown/contracts";
import { createApp } from "../../app.js";
import { closeDatabase, connectDatabase } from "../../db/sequelize.js";
import { testConfig } from "../../test/harness.js";

// Port 1 on loopback: nothing listens there, so every connection is refused at once.
const unreachable = "postgres://postgres@127.0.0.1:1/ringdown_test";
connectDatabase(unreachable);
const app = createApp(testConfig({ databaseUrl: unreachable }));
afterAll(closeDatabase);

describe("GET /api/health with the database unreachable", () => {
  it("answers 503 with the database down", async () => {
    const res = await request(app).get("/api/health");
    expect(res.status).toBe(503);
    expect(healthSchema.parse(res.body)).toMatchObject({ status: "degraded", database: "down" });
  });

  it("answers other routes with a 503 envelope rather than a generic 500, and logs the cause", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const res = await request(app).post("/api/auth/login").send({ email: "someone@tests.example", password: "whatever-it-is" });
    expect(res.status).toBe(503);
    expect(res.body).toEqual({
      error: { code: "service_unavailable", message: "The database is unavailable. Try again in a moment." },
    });
    expect(res.headers["retry-after"]).toBe("5");
    expect(String(log.mock.calls[0]?.[0])).toMatch(/ECONNREFUSED/);
    log.mockRestore();
  });
});
