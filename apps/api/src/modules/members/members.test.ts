import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, memberPageSchema } from "@ringdown/contracts";
import { disconnectTestDatabase, joinShop, makeTestApp, createPerson, type SignedUp } from "../../test/harness.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

describe("GET /api/shops/:shopId/members", () => {
  let owner: SignedUp;
  let operator: SignedUp;
  let programmer: SignedUp;
  let otherShopPerson: SignedUp;

  beforeAll(async () => {
    [owner, operator, programmer, otherShopPerson] = await Promise.all([
      createPerson(app, "m-owner", "Members shop"),
      createPerson(app, "m-operator"),
      createPerson(app, "m-programmer"),
      createPerson(app, "m-elsewhere"),
    ]);
    await joinShop(operator.userId, owner.shopId, "operator");
    await joinShop(programmer.userId, owner.shopId, "programmer");
  });

  it("lists the shop's members, owners first, to any member (operators included)", async () => {
    const res = await operator.agent.get(`/api/shops/${owner.shopId}/members`);
    expect(res.status).toBe(200);
    const page = memberPageSchema.parse(res.body);
    expect(page).toMatchObject({ page: 1, pageSize: 25, total: 3 });
    expect(page.items.map((m) => [m.email, m.role])).toEqual([
      [owner.email, "owner"],
      [programmer.email, "programmer"],
      [operator.email, "operator"],
    ]);
    // Only this shop's people: the person of another shop is absent.
    expect(page.items.some((m) => m.userId === otherShopPerson.userId)).toBe(false);
  });

  it("pages through the list", async () => {
    const first = memberPageSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/members?pageSize=2`)).body);
    const second = memberPageSchema.parse(
      (await owner.agent.get(`/api/shops/${owner.shopId}/members?pageSize=2&page=2`)).body,
    );
    expect(first.items).toHaveLength(2);
    expect(second.items).toHaveLength(1);
    expect(second).toMatchObject({ page: 2, pageSize: 2, total: 3 });
    expect(new Set([...first.items, ...second.items].map((m) => m.userId)).size).toBe(3);
  });

  it("answers 400 naming the query field for a bad page size", async () => {
    const res = await owner.agent.get(`/api/shops/${owner.shopId}/members?pageSize=0`);
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {})).toEqual(["query.pageSize"]);
  });
});
