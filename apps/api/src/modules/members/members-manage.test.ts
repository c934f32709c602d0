import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, memberPageSchema, memberSchema, meSchema } from "@ringdown/contracts";
import type { Express } from "express";
import { getSequelize } from "../../db/sequelize.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, TEST_PASSWORD, type SignedUp } from "../../test/harness.js";
import { saveSubscription } from "../billing/billing.repository.js";

let app: Express;
beforeAll(() => {
  app = makeTestApp();
});
afterAll(disconnectTestDatabase);

const errorOf = (body: unknown) => apiErrorSchema.parse(body).error;

/** A shop on a paid team plan with enough seats (set directly: billing has its own tests). */
async function teamShop(label: string, seats = 10): Promise<SignedUp> {
  const owner = await createPerson(app, label, `Shop ${label}`);
  await saveSubscription(owner.shopId, { status: "active", seats, providerSubscriptionId: `sub_local_${owner.shopId}` });
  return owner;
}

describe("PATCH /api/shops/:shopId/members/:userId", () => {
  it("lets an owner change a role; the person's next request sees the new role", async () => {
    const owner = await teamShop("role-owner");
    const person = await createPerson(app, "role-person");
    await joinShop(person.userId, owner.shopId, "operator");
    const res = await owner.agent.patch(`/api/shops/${owner.shopId}/members/${person.userId}`).send({ role: "programmer" });
    expect(res.status).toBe(200);
    expect(memberSchema.parse(res.body)).toMatchObject({ userId: person.userId, role: "programmer" });
    const me = meSchema.parse((await person.agent.get("/api/me")).body);
    expect(me.memberships.find((m) => m.shopId === owner.shopId)?.role).toBe("programmer");
  });

  it("refuses non-owners (403) and unknown members (404) and bad roles (400)", async () => {
    const owner = await teamShop("role-owner2");
    const manager = await createPerson(app, "role-manager");
    await joinShop(manager.userId, owner.shopId, "tooling_manager");
    expect((await manager.agent.patch(`/api/shops/${owner.shopId}/members/${owner.userId}`).send({ role: "operator" })).status).toBe(403);
    const stranger = await createPerson(app, "role-stranger");
    const missing = await owner.agent.patch(`/api/shops/${owner.shopId}/members/${stranger.userId}`).send({ role: "operator" });
    expect(missing.status).toBe(404);
    expect(errorOf(missing.body).message).toBe("No member with this id in this shop.");
    const bad = await owner.agent.patch(`/api/shops/${owner.shopId}/members/${manager.userId}`).send({ role: "admiral" });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {})).toEqual(["role"]);
  });

  it("never demotes the last owner (409 with what to do), but does once there is a second owner", async () => {
    const owner = await teamShop("last-owner");
    const res = await owner.agent.patch(`/api/shops/${owner.shopId}/members/${owner.userId}`).send({ role: "programmer" });
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toBe(
      "A shop needs at least one owner, and this is the only one. Make another member an owner first, then change this role.",
    );
    const second = await createPerson(app, "second-owner");
    await joinShop(second.userId, owner.shopId, "programmer");
    await owner.agent.patch(`/api/shops/${owner.shopId}/members/${second.userId}`).send({ role: "owner" }).expect(200);
    const demoted = await second.agent.patch(`/api/shops/${owner.shopId}/members/${owner.userId}`).send({ role: "programmer" });
    expect(demoted.status).toBe(200);
    // Now `second` is the only owner again.
    expect((await second.agent.patch(`/api/shops/${owner.shopId}/members/${second.userId}`).send({ role: "operator" })).status).toBe(409);
  });

  it("two owners demoting each other at once leave exactly one owner", async () => {
    const a = await teamShop("race-a");
    const b = await createPerson(app, "race-b");
    await joinShop(b.userId, a.shopId, "owner");
    const [one, two] = await Promise.all([
      a.agent.patch(`/api/shops/${a.shopId}/members/${b.userId}`).send({ role: "programmer" }),
      b.agent.patch(`/api/shops/${a.shopId}/members/${a.userId}`).send({ role: "programmer" }),
    ]);
    // One succeeds; the other is refused: as the last owner (409) or as no longer an owner (403).
    const statuses = [one.status, two.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const [rows] = await getSequelize().query(`SELECT count(*)::int AS n FROM memberships WHERE shop_id = $1 AND role = 'owner'`, { bind: [a.shopId] });
    expect((rows as Array<{ n: number }>)[0]!.n).toBe(1);
  });

  it("moving an operator to a paid role needs a free paid seat", async () => {
    const owner = await createPerson(app, "seat-role"); // free plan: the owner takes the only paid seat
    const operator = await createPerson(app, "seat-operator");
    await joinShop(operator.userId, owner.shopId, "operator");
    const res = await owner.agent.patch(`/api/shops/${owner.shopId}/members/${operator.userId}`).send({ role: "programmer" });
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toMatch(/free plan includes 1 paid seat.*Billing page/);
  });
});

describe("DELETE /api/shops/:shopId/members/:userId", () => {
  it("removes in one step: every session of the person ends at once, their account stays", async () => {
    const owner = await teamShop("rm-owner");
    const person = await createPerson(app, "rm-person");
    await joinShop(person.userId, owner.shopId, "programmer");
    const secondDevice = await request(app).post("/api/auth/login").send({ email: person.email, password: TEST_PASSWORD });
    const secondCookie = ([] as string[]).concat(secondDevice.headers["set-cookie"] ?? []).find((c) => c.startsWith("rd_session="))!.split(";")[0]!;
    expect((await person.agent.get(`/api/shops/${owner.shopId}/members`)).status).toBe(200);

    expect((await owner.agent.delete(`/api/shops/${owner.shopId}/members/${person.userId}`)).status).toBe(204);

    expect((await person.agent.get("/api/me")).status).toBe(401);
    expect((await request(app).get("/api/me").set("Cookie", secondCookie)).status).toBe(401);
    const page = memberPageSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/members`)).body);
    expect(page.items.map((m) => m.userId)).not.toContain(person.userId);

    // The account (and so everything it authored, which references it) is still there.
    const [rows] = await getSequelize().query(`SELECT count(*)::int AS n FROM users WHERE id = $1`, { bind: [person.userId] });
    expect((rows as Array<{ n: number }>)[0]!.n).toBe(1);
    const again = await request(app).post("/api/auth/login").send({ email: person.email, password: TEST_PASSWORD });
    expect(again.status).toBe(200);
    expect(meSchema.parse(again.body).memberships.map((m) => m.shopId)).not.toContain(owner.shopId);
  });

  it("never removes the last owner (409), and refuses non-owners (403)", async () => {
    const owner = await teamShop("rm-last");
    const res = await owner.agent.delete(`/api/shops/${owner.shopId}/members/${owner.userId}`);
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toMatch(/needs at least one owner/);
    const programmer = await createPerson(app, "rm-programmer");
    await joinShop(programmer.userId, owner.shopId, "programmer");
    expect((await programmer.agent.delete(`/api/shops/${owner.shopId}/members/${owner.userId}`)).status).toBe(403);
  });
});
