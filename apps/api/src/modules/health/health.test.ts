import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { healthSchema } from "@ringdown/contracts";
import { disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import { apiVersion } from "../../version.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

describe("GET /api/health", () => {
  it("answers 200 with the database up and the API version, without a session", async () => {
    const res = await request(app).get("/api/health");
    expect(res.status).toBe(200);
    expect(healthSchema.parse(res.body)).toEqual({ status: "ok", database: "up", version: apiVersion });
    expect(res.headers["cache-control"]).toBe("no-store");
  });
});
