import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, meSchema, roles, shopSchema, type Role } from "@ringdown/contracts";
import { createShopScopedRouter, listRoutes } from "../../routes.js";
import { disconnectTestDatabase, joinShop, makeTestApp, createPerson, type SignedUp } from "../../test/harness.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

describe("POST /api/shops", () => {
  it("creates a shop owned by the caller and makes it the active shop", async () => {
    const person = await createPerson(app, "founder", "Original shop");
    const res = await person.agent.post("/api/shops").send({ name: "  Night-shift annex " });
    expect(res.status).toBe(201);
    const shop = shopSchema.parse(res.body);
    expect(shop).toMatchObject({ name: "Night-shift annex", role: "owner" });
    expect(Number.isNaN(Date.parse(shop.createdAt))).toBe(false);

    const me = meSchema.parse((await person.agent.get("/api/me")).body);
    expect(me.activeShopId).toBe(shop.id);
    expect(me.memberships.map((m) => m.shopId).sort()).toEqual([person.shopId, shop.id].sort());
  });

  it("answers 400 with a field error for a missing name and 401 without a session", async () => {
    const person = await createPerson(app, "noname");
    const res = await person.agent.post("/api/shops").send({ name: " " });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ name: "Enter the shop's name" });
    expect((await request(app).post("/api/shops").send({ name: "Anon shop" })).status).toBe(401);
  });
});

describe("GET and PATCH /api/shops/:shopId", () => {
  let owner: SignedUp;
  const members = {} as Record<Exclude<Role, "owner">, SignedUp>;

  beforeAll(async () => {
    owner = await createPerson(app, "owner", "Role test shop");
    for (const role of roles.filter((r): r is Exclude<Role, "owner"> => r !== "owner")) {
      members[role] = await createPerson(app, role);
      await joinShop(members[role].userId, owner.shopId, role);
    }
  });

  it("shows the shop to every member, with that member's role", async () => {
    for (const [role, member] of Object.entries(members)) {
      const res = await member.agent.get(`/api/shops/${owner.shopId}`);
      expect(res.status).toBe(200);
      expect(shopSchema.parse(res.body)).toMatchObject({ id: owner.shopId, name: "Role test shop", role });
    }
  });

  it("lets the owner rename the shop", async () => {
    const res = await owner.agent.patch(`/api/shops/${owner.shopId}`).send({ name: "Renamed role test shop" });
    expect(res.status).toBe(200);
    expect(shopSchema.parse(res.body)).toMatchObject({ id: owner.shopId, name: "Renamed role test shop", role: "owner" });
    await owner.agent.patch(`/api/shops/${owner.shopId}`).send({ name: "Role test shop" }).expect(200);
  });

  it.each(["tooling_manager", "programmer", "operator"] as const)("refuses a %s renaming the shop with 403", async (role) => {
    const res = await members[role].agent.patch(`/api/shops/${owner.shopId}`).send({ name: "Hijacked" });
    expect(res.status).toBe(403);
    const error = apiErrorSchema.parse(res.body).error;
    expect(error).toEqual({ code: "forbidden", message: "Only the owner of this shop can do this." });
    const shop = shopSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}`)).body);
    expect(shop.name).toBe("Role test shop");
  });

  it("checks the role before the body: a non-owner with an invalid body still gets 403", async () => {
    const res = await members.operator.agent.patch(`/api/shops/${owner.shopId}`).send({ name: "" });
    expect(res.status).toBe(403);
  });

  it("answers 400 with a field error when the owner sends a bad name", async () => {
    const res = await owner.agent.patch(`/api/shops/${owner.shopId}`).send({ name: "x".repeat(121) });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ name: "Use at most 120 characters" });
  });
});

describe("shop isolation: every shop-scoped route answers 404 to non-members", () => {
  const routes = listRoutes(createShopScopedRouter());
  let shopA: SignedUp;
  let outsider: SignedUp;

  /** Fills the route's own parameters (e.g. /members/:memberId) with fresh ids. */
  const urlFor = (shopId: string, path: string) =>
    `/api/shops/${shopId}${path === "/" ? "" : path.replace(/:[A-Za-z]+/g, () => randomUUID())}`;

  beforeAll(async () => {
    shopA = await createPerson(app, "isolated-owner", "Isolated shop A");
    outsider = await createPerson(app, "outsider", "Outsider's shop B");
  });

  it("knows the shop-scoped routes that exist", () => {
    const keys = routes.map((r) => `${r.method} ${r.path}`);
    // The list is read from the router; this only guards against it coming back empty.
    expect(keys).toEqual(expect.arrayContaining(["GET /", "PATCH /", "GET /members"]));
  });

  it.each(routes.map((r) => [r.method, r.path] as const))(
    "%s %s of another shop → 404, identical to a shop that does not exist",
    async (method, path) => {
      const send = (shopId: string) => {
        const req = outsider.agent[method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete"](urlFor(shopId, path));
        return method === "GET" || method === "DELETE" ? req : req.send({ name: "Probe" });
      };
      const foreign = await send(shopA.shopId);
      expect(foreign.status).toBe(404);
      expect(apiErrorSchema.parse(foreign.body).error).toEqual({ code: "not_found", message: "Shop not found." });

      const missing = await send(randomUUID());
      expect(missing.status).toBe(404);
      expect(missing.body).toEqual(foreign.body);

      // A member of shop A passes the membership check on the same route, so the 404 above is
      // about membership (a member may still get another 404 for a record id that does not exist).
      const own = await shopA.agent[method.toLowerCase() as "get"](urlFor(shopA.shopId, path)).send(
        method === "GET" ? undefined : { name: "Isolated shop A" },
      );
      expect(own.body?.error?.message).not.toBe("Shop not found.");
    },
  );

  it("answers 404 for a malformed shop id and 401 without a session", async () => {
    const bad = await outsider.agent.get("/api/shops/not-a-uuid");
    expect(bad.status).toBe(404);
    expect(apiErrorSchema.parse(bad.body).error.code).toBe("not_found");
    expect((await request(app).get(`/api/shops/${shopA.shopId}`)).status).toBe(401);
  });

  it("never changes another shop: a non-member's PATCH leaves the name as it was", async () => {
    await outsider.agent.patch(`/api/shops/${shopA.shopId}`).send({ name: "Taken over" }).expect(404);
    const shop = shopSchema.parse((await shopA.agent.get(`/api/shops/${shopA.shopId}`)).body);
    expect(shop.name).toBe("Isolated shop A");
  });
});
