import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { apiErrorSchema, meSchema, shopSchema } from "@ringdown/contracts";
import { disconnectTestDatabase, joinShop, makeTestApp, createPerson } from "../../test/harness.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

describe("GET /api/me", () => {
  it("returns the person, every shop they belong to with their role, and the active shop", async () => {
    const contractor = await createPerson(app, "contractor", "Contractor's own shop");
    const client = await createPerson(app, "client", "Client shop");
    await joinShop(contractor.userId, client.shopId, "programmer");

    const me = meSchema.parse((await contractor.agent.get("/api/me").expect(200)).body);
    expect(me.user).toEqual({ id: contractor.userId, email: contractor.email, name: "Test contractor", unitSystem: "metric" });
    expect(me.memberships).toEqual([
      { shopId: client.shopId, shopName: "Client shop", role: "programmer" },
      { shopId: contractor.shopId, shopName: "Contractor's own shop", role: "owner" },
    ]);
    expect(me.activeShopId).toBe(contractor.shopId);
  });
});

describe("PATCH /api/me", () => {
  it("stores the unit system and the name", async () => {
    const person = await createPerson(app, "prefs");
    const res = await person.agent.patch("/api/me").send({ unitSystem: "imperial", name: "  Pat Prefs " });
    expect(res.status).toBe(200);
    const me = meSchema.parse(res.body);
    expect(me.user.unitSystem).toBe("imperial");
    expect(me.user.name).toBe("Pat Prefs");
    expect(meSchema.parse((await person.agent.get("/api/me")).body).user.unitSystem).toBe("imperial");
  });

  it("switches the active shop to another of the person's shops", async () => {
    const person = await createPerson(app, "switcher", "First shop");
    const second = shopSchema.parse((await person.agent.post("/api/shops").send({ name: "Second shop" }).expect(201)).body);
    const back = meSchema.parse((await person.agent.patch("/api/me").send({ activeShopId: person.shopId }).expect(200)).body);
    expect(back.activeShopId).toBe(person.shopId);
    const again = meSchema.parse((await person.agent.patch("/api/me").send({ activeShopId: second.id }).expect(200)).body);
    expect(again.activeShopId).toBe(second.id);
  });

  it("answers 404 when the shop is not one of the person's, and keeps the active shop", async () => {
    const person = await createPerson(app, "nosy");
    const stranger = await createPerson(app, "stranger");
    const res = await person.agent.patch("/api/me").send({ activeShopId: stranger.shopId });
    expect(res.status).toBe(404);
    expect(apiErrorSchema.parse(res.body).error.code).toBe("not_found");
    expect(meSchema.parse((await person.agent.get("/api/me")).body).activeShopId).toBe(person.shopId);
  });

  it("answers 400 for an empty change, an unknown unit system or a malformed shop id", async () => {
    const person = await createPerson(app, "badpatch");
    const empty = await person.agent.patch("/api/me").send({});
    expect(empty.status).toBe(400);
    expect(apiErrorSchema.parse(empty.body).error.message).toBe("Send at least one field to change");

    const units = await person.agent.patch("/api/me").send({ unitSystem: "cubits" });
    expect(units.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(units.body).error.fields ?? {})).toEqual(["unitSystem"]);

    const shop = await person.agent.patch("/api/me").send({ activeShopId: "shop-1" });
    expect(shop.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(shop.body).error.fields ?? {})).toEqual(["activeShopId"]);
  });

  it("answers 401 without a session", async () => {
    const res = await request(app).patch("/api/me").send({ unitSystem: "imperial" });
    expect(res.status).toBe(401);
  });
});
