import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, cutterPageSchema, cutterSchema, type Cutter } from "@ringdown/contracts";
import { disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import {
  cutterBody,
  globalMaterialId,
  insertRecipeRow,
  machineBody,
  needsRecheck,
  teamShop,
  type Team,
} from "../machines/library-test-fixtures.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let team: Team;
let other: Team;
const base = () => `/api/shops/${team.shopId}/cutters`;

beforeAll(async () => {
  team = await teamShop(app, "cut");
  other = await teamShop(app, "cut-other");
});

async function create(role: keyof Omit<Team, "shopId">, overrides: Record<string, unknown> = {}): Promise<Cutter> {
  const res = await team[role].agent.post(base()).send(cutterBody(overrides));
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return cutterSchema.parse(res.body);
}

describe("POST /cutters", () => {
  it("makes a programmer's cutter a proposal, and refuses them an approved one", async () => {
    const proposed = await create("programmer", { name: "Programmer's proposal" });
    expect(proposed).toMatchObject({ status: "proposed", shopId: team.shopId, maker: "", tipAngleDeg: null, deletedAt: null });
    const res = await team.programmer.agent.post(base()).send(cutterBody({ status: "approved" }));
    expect(res.status).toBe(403);
    expect(apiErrorSchema.parse(res.body).error.message).toBe(
      "Only a tooling manager or owner can add an approved cutter; propose it instead.",
    );
  });

  it("lets tooling managers and owners add approved cutters directly; operators cannot add any", async () => {
    expect((await create("tooling_manager", { status: "approved" })).status).toBe("approved");
    expect((await create("owner", { status: "approved" })).status).toBe("approved");
    expect((await create("owner")).status).toBe("proposed");
    expect((await team.operator.agent.post(base()).send(cutterBody())).status).toBe(403);
  });

  it("answers 400 with a message per field path", async () => {
    const res = await team.owner.agent
      .post(base())
      .send(cutterBody({ flutes: 1.5, fluteLengthMm: 80, overallLengthMm: 60, cornerRadiusMm: 4, shape: "spoon", status: "retired" }));
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({
      flutes: "Flutes must be a whole number",
      shape: expect.any(String),
      status: expect.any(String),
    });
    // Rules across fields run once the fields themselves are valid.
    const cross = await team.owner.agent.post(base()).send(cutterBody({ fluteLengthMm: 80, overallLengthMm: 60, cornerRadiusMm: 4 }));
    expect(apiErrorSchema.parse(cross.body).error.fields).toEqual({
      fluteLengthMm: "Flute length cannot exceed the overall length",
      cornerRadiusMm: "Corner radius cannot exceed half the diameter",
    });
  });
});

describe("GET /cutters", () => {
  let ids: Record<string, string>;
  let listShop: Team;
  beforeAll(async () => {
    const shop = await teamShop(app, "cut-list");
    const add = async (o: Record<string, unknown>) =>
      cutterSchema.parse((await shop.owner.agent.post(`/api/shops/${shop.shopId}/cutters`).send(cutterBody(o))).body).id;
    ids = {
      small: await add({ name: "Alpha 3 mm ball", shape: "ball", diameterMm: 3, cornerRadiusMm: 1.5, fluteLengthMm: 10, status: "approved" }),
      big: await add({ name: "Bravo 12 mm flat", diameterMm: 12, toolMaterial: "hss", maker: "house stock", status: "approved" }),
      mid: await add({ name: "Charlie 6 mm vee", shape: "vee", tipAngleDeg: 60, partNumber: "VX-60" }),
    };
    listShop = shop;
  });
  const get = (query: Record<string, unknown>) =>
    listShop.operator.agent.get(`/api/shops/${listShop.shopId}/cutters`).query(query);

  it("filters by status, shape, tool material and text (name, maker, part number)", async () => {
    const names = async (q: Record<string, unknown>) => cutterPageSchema.parse((await get(q)).body).items.map((c) => c.id);
    expect(await names({ status: "proposed" })).toEqual([ids.mid]);
    expect(await names({ shape: "ball" })).toEqual([ids.small]);
    expect(await names({ toolMaterial: "hss" })).toEqual([ids.big]);
    expect(await names({ q: "HOUSE" })).toEqual([ids.big]);
    expect(await names({ q: "vx-6" })).toEqual([ids.mid]);
  });

  it("sorts and pages", async () => {
    const desc = cutterPageSchema.parse((await get({ sort: "diameterMm", dir: "desc" })).body);
    expect(desc.items.map((c) => c.diameterMm)).toEqual([12, 6, 3]);
    const page = cutterPageSchema.parse((await get({ sort: "name", page: 2, pageSize: 2 })).body);
    expect(page).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(page.items.map((c) => c.id)).toEqual([ids.mid]);
    const bad = await get({ sort: "colour", dir: "sideways", deleted: "maybe" });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {}).sort()).toEqual(["query.deleted", "query.dir", "query.sort"]);
  });

  it("answers 404 for another shop's cutter and a malformed id", async () => {
    const res = await other.owner.agent.get(`/api/shops/${other.shopId}/cutters/${ids.small}`);
    expect(res.status).toBe(404);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("Cutter not found.");
    expect((await listShop.owner.agent.get(`/api/shops/${listShop.shopId}/cutters/xyz`)).status).toBe(404);
    const own = await listShop.operator.agent.get(`/api/shops/${listShop.shopId}/cutters/${ids.small}`);
    expect(cutterSchema.parse(own.body).name).toBe("Alpha 3 mm ball");
  });
});

describe("PATCH /cutters/:id", () => {
  it("lets programmers edit a proposal only; tooling managers edit any; fields not sent stay", async () => {
    const c = await create("programmer", { name: "Editable", notes: "keep me" });
    const edited = await team.programmer.agent.patch(`${base()}/${c.id}`).send({ diameterMm: 6.35 });
    expect(edited.status).toBe(200);
    expect(cutterSchema.parse(edited.body)).toMatchObject({ diameterMm: 6.35, notes: "keep me", name: "Editable", status: "proposed" });

    await team.tooling_manager.agent.post(`${base()}/${c.id}/transition`).send({ to: "approved" }).expect(200);
    const refused = await team.programmer.agent.patch(`${base()}/${c.id}`).send({ notes: "sneaky" });
    expect(refused.status).toBe(403);
    expect(apiErrorSchema.parse(refused.body).error.message).toMatch(/only while it is proposed; this one is approved/);
    const byManager = await team.tooling_manager.agent.patch(`${base()}/${c.id}`).send({ notes: "checked" });
    expect(cutterSchema.parse(byManager.body)).toMatchObject({ notes: "checked", status: "approved", diameterMm: 6.35 });
    expect((await team.operator.agent.patch(`${base()}/${c.id}`).send({ notes: "x" })).status).toBe(403);
  });

  it("validates the merged cutter (a shorter overall length than the flutes is refused)", async () => {
    const c = await create("owner");
    const res = await team.owner.agent.patch(`${base()}/${c.id}`).send({ overallLengthMm: 10 });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ fluteLengthMm: "Flute length cannot exceed the overall length" });
    const bad = await team.owner.agent.patch(`${base()}/${c.id}`).send({ flutes: 0 });
    expect(apiErrorSchema.parse(bad.body).error.fields).toEqual({ flutes: "At least 1 flute" });
  });
});

describe("POST /cutters/:id/transition", () => {
  it("follows proposed → approved → retired → approved, for tooling managers and owners only", async () => {
    const c = await create("programmer");
    const move = (role: "owner" | "tooling_manager" | "programmer", to: string) =>
      team[role].agent.post(`${base()}/${c.id}/transition`).send({ to });

    expect((await move("programmer", "approved")).status).toBe(403);
    const bad = await move("owner", "retired");
    expect(bad.status).toBe(409);
    expect(apiErrorSchema.parse(bad.body).error.message).toBe(
      "A proposed cutter can only become approved. Delete the proposal instead.",
    );
    expect(cutterSchema.parse((await move("tooling_manager", "approved")).body).status).toBe("approved");
    const same = await move("owner", "approved");
    expect(same.status).toBe(409);
    expect(apiErrorSchema.parse(same.body).error.message).toBe("This cutter is already approved.");
    expect((await move("owner", "proposed")).status).toBe(409);
    expect(cutterSchema.parse((await move("owner", "retired")).body).status).toBe("retired");
    expect(cutterSchema.parse((await move("tooling_manager", "approved")).body).status).toBe("approved");

    const invalid = await move("owner", "lost");
    expect(invalid.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(invalid.body).error.fields ?? {})).toEqual(["to"]);
    expect((await team.owner.agent.post(`${base()}/${randomUUID()}/transition`).send({ to: "approved" })).status).toBe(404);
  });
});

describe("DELETE /cutters/:id and restore", () => {
  it("refuses while an assembly or recipe uses the cutter, saying to retire it", async () => {
    const c = await create("owner", { status: "approved", name: "Busy cutter" });
    const machine = (await team.owner.agent.post(`/api/shops/${team.shopId}/machines`).send(machineBody())).body as { id: string };
    const assembly = (
      await team.programmer.agent
        .post(`/api/shops/${team.shopId}/assemblies`)
        .send({ machineId: machine.id, cutterId: c.id, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 })
    ).body as { id: string };

    const one = await team.owner.agent.delete(`${base()}/${c.id}`);
    expect(one.status).toBe(409);
    expect(apiErrorSchema.parse(one.body).error.message).toBe("This cutter is used by 1 assembly — retire it instead.");

    const recipeId = await insertRecipeRow({
      shopId: team.shopId,
      assemblyId: assembly.id,
      machineId: machine.id,
      cutterId: c.id,
      materialId: await globalMaterialId("mdf"),
      authorId: team.owner.userId,
    });
    const two = await team.owner.agent.delete(`${base()}/${c.id}`);
    expect(apiErrorSchema.parse(two.body).error.message).toBe("This cutter is used by 1 recipe and 1 assembly — retire it instead.");
    expect(cutterSchema.parse((await team.owner.agent.get(`${base()}/${c.id}`)).body).deletedAt).toBeNull();

    // A geometry change asks the recipe for a re-check; a new part number does not.
    await team.owner.agent.patch(`${base()}/${c.id}`).send({ partNumber: "P-2" }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(false);
    await team.owner.agent.patch(`${base()}/${c.id}`).send({ helixDeg: 35 }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(true);
  });

  it("moves an unused cutter to the bin and back; programmers may bin only proposals", async () => {
    const approved = await create("owner", { status: "approved", name: "Binned approved" });
    expect((await team.programmer.agent.delete(`${base()}/${approved.id}`)).status).toBe(403);
    expect((await team.operator.agent.delete(`${base()}/${approved.id}`)).status).toBe(403);
    expect((await team.tooling_manager.agent.delete(`${base()}/${approved.id}`)).status).toBe(204);
    expect((await team.tooling_manager.agent.delete(`${base()}/${approved.id}`)).status).toBe(404);

    const list = cutterPageSchema.parse((await team.owner.agent.get(base()).query({ pageSize: 200 })).body);
    expect(list.items.map((c) => c.id)).not.toContain(approved.id);
    const bin = cutterPageSchema.parse((await team.owner.agent.get(base()).query({ deleted: "true" })).body);
    expect(bin.items.map((c) => c.id)).toContain(approved.id);
    expect((await team.owner.agent.patch(`${base()}/${approved.id}`).send({ notes: "x" })).status).toBe(409);

    expect((await team.programmer.agent.post(`${base()}/${approved.id}/restore`)).status).toBe(403);
    const restored = await team.owner.agent.post(`${base()}/${approved.id}/restore`);
    expect(restored.status).toBe(200);
    expect(cutterSchema.parse(restored.body)).toMatchObject({ deletedAt: null, status: "approved" });

    const proposal = await create("programmer", { name: "Withdrawn proposal" });
    expect((await team.programmer.agent.delete(`${base()}/${proposal.id}`)).status).toBe(204);
    expect(cutterSchema.parse((await team.programmer.agent.post(`${base()}/${proposal.id}/restore`)).body).deletedAt).toBeNull();
  });
});
