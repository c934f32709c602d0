import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  planRecipe,
  recipePageSchema,
  recipeParamsSchema,
  recipeRevisionListSchema,
  recipeSchema,
  summarizeRecommendation,
  type Recipe,
} from "@ringdown/contracts";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { findAssemblyRecords, findUsableMaterial } from "../recommendations/planning.repository.js";
import { libraryFor } from "./recipe-test-fixtures.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

type Role = "owner" | "tooling_manager" | "programmer" | "operator";
let people: Record<Role, SignedUp>;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let outsider: SignedUp;
let outsiderLib: Awaited<ReturnType<typeof libraryFor>>;
let shopId: string;
const url = (path = "") => `/api/shops/${shopId}/recipes${path}`;

const params = { axialDepthMm: 3, radialDepthMm: 1.5 };

async function create(overrides: Record<string, unknown> = {}, who: Role = "programmer"): Promise<Recipe> {
  const res = await people[who].agent
    .post(url())
    .send({ name: "Pocket wall finish", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params, ...overrides });
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return recipeSchema.parse(res.body);
}

beforeAll(async () => {
  const owner = await createPerson(app, "r-owner", "Recipe shop");
  shopId = owner.shopId;
  const [tm, prog, op] = await Promise.all([createPerson(app, "r-tm"), createPerson(app, "r-prog"), createPerson(app, "r-op")]);
  await Promise.all([joinShop(tm.userId, shopId, "tooling_manager"), joinShop(prog.userId, shopId, "programmer"), joinShop(op.userId, shopId, "operator")]);
  people = { owner, tooling_manager: tm, programmer: prog, operator: op };
  lib = await libraryFor(shopId);
  outsider = await createPerson(app, "r-outsider", "Other recipe shop");
  outsiderLib = await libraryFor(outsider.shopId);
});

/** What the engine gives for these records (the server must store exactly this). */
async function expectedSummary(assemblyId: string, materialId: string, operation: "profile" | "slot", p: Record<string, unknown>) {
  const records = (await findAssemblyRecords(shopId, assemblyId))!;
  const material = (await findUsableMaterial(shopId, materialId))!;
  return summarizeRecommendation(planRecipe({ ...records, material, operation, params: recipeParamsSchema.parse(p) }));
}

describe("POST recipes", () => {
  it("creates a draft, recomputed by the server, ignoring numbers sent by the browser", async () => {
    const res = await people.programmer.agent.post(url()).send({
      name: "Pocket wall finish",
      assemblyId: lib.routerAssemblyId,
      materialId: lib.aluminiumId,
      operation: "profile",
      params,
      // A browser cannot dictate results: these are not part of the body and are ignored.
      result: { rpm: 999999, feedMmPerMin: 1 },
      rpm: 999999,
      status: "approved",
    });
    expect(res.status).toBe(201);
    const recipe = recipeSchema.parse(res.body);
    expect(recipe).toMatchObject({ status: "draft", revision: 1, machineId: lib.routerId, cutterId: lib.cutterId, authorId: people.programmer.userId });
    expect(recipe).toMatchObject({ machineName: "Test gantry router", cutterName: "Test 6 mm 2F flat", materialName: "Test aluminium 6061", lastComment: null });
    expect(recipe.result).toEqual(await expectedSummary(lib.routerAssemblyId, lib.aluminiumId, "profile", params));
    expect(recipe.result.rpm).not.toBe(999999);
    expect(recipe.result.rpm).toBeLessThanOrEqual(24000);

    const revisions = recipeRevisionListSchema.parse((await people.programmer.agent.get(url(`/${recipe.id}/revisions`))).body);
    expect(revisions.items).toHaveLength(1);
    expect(revisions.items[0]).toMatchObject({ revision: 1, changeNote: "Created", authorName: "Test r-prog", changes: [] });
  });

  it("answers 400 with field messages for a bad body", async () => {
    const res = await people.programmer.agent.post(url()).send({ name: "", assemblyId: "nope", operation: "spin", params: { axialDepthMm: -1 } });
    expect(res.status).toBe(400);
    const fields = apiErrorSchema.parse(res.body).error.fields ?? {};
    expect(Object.keys(fields)).toEqual(expect.arrayContaining(["name", "assemblyId", "materialId", "operation", "params.axialDepthMm", "params.radialDepthMm"]));
  });

  it("answers 400 naming the field when the engine refuses the cut (deeper than the flutes)", async () => {
    const res = await people.programmer.agent
      .post(url())
      .send({ name: "Too deep", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 25, radialDepthMm: 1 } });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields?.["params.axialDepthMm"]).toMatch(/flute length/);
  });

  it("refuses another shop's assembly and material as if they did not exist", async () => {
    const res = await people.programmer.agent
      .post(url())
      .send({ name: "Borrowed", assemblyId: outsiderLib.routerAssemblyId, materialId: outsiderLib.aluminiumId, operation: "profile", params });
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {}).sort()).toEqual(["assemblyId", "materialId"]);
  });

  it("lets programmers and up create, not operators (403)", async () => {
    for (const who of ["owner", "tooling_manager"] as const) expect((await create({}, who)).status).toBe("draft");
    const res = await people.operator.agent
      .post(url())
      .send({ name: "x", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params });
    expect(res.status).toBe(403);
  });
});

describe("GET recipes/:id", () => {
  it("returns the recipe with names; unknown and malformed ids are 404", async () => {
    const recipe = await create();
    const got = recipeSchema.parse((await people.tooling_manager.agent.get(url(`/${recipe.id}`)).expect(200)).body);
    expect(got).toEqual(recipe);
    expect((await people.owner.agent.get(url(`/${randomUUID()}`))).status).toBe(404);
    expect((await people.owner.agent.get(url("/not-an-id"))).status).toBe(404);
  });

  it("hides recipes that are not approved from operators (404)", async () => {
    const recipe = await create();
    const res = await people.operator.agent.get(url(`/${recipe.id}`));
    expect(res.status).toBe(404);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("Recipe not found.");
  });

  it("answers 404 for a recipe of another shop, even through the own shop's URL", async () => {
    const theirs = await outsider.agent
      .post(`/api/shops/${outsider.shopId}/recipes`)
      .send({ name: "Theirs", assemblyId: outsiderLib.routerAssemblyId, materialId: outsiderLib.aluminiumId, operation: "profile", params })
      .expect(201);
    expect((await people.owner.agent.get(url(`/${theirs.body.id}`))).status).toBe(404);
    expect((await people.owner.agent.get(`/api/shops/${outsider.shopId}/recipes/${theirs.body.id}`)).status).toBe(404);
  });
});

describe("PATCH recipes/:id, revisions and restore", () => {
  it("writes a new revision per edit with who, what and when, newest first", async () => {
    const recipe = await create();
    const edited = recipeSchema.parse(
      (await people.programmer.agent.patch(url(`/${recipe.id}`)).send({ params: { ...params, axialDepthMm: 2 }, changeNote: "Shallower for the thin wall" }).expect(200)).body,
    );
    expect(edited.revision).toBe(2);
    expect(edited.params.axialDepthMm).toBe(2);
    expect(edited.result).toEqual(await expectedSummary(lib.routerAssemblyId, lib.aluminiumId, "profile", { ...params, axialDepthMm: 2 }));
    // Only the sent fields change: the notes and name stay.
    await people.programmer.agent.patch(url(`/${recipe.id}`)).send({ notes: "Use the soft jaws" }).expect(200);
    const renamed = recipeSchema.parse((await people.owner.agent.patch(url(`/${recipe.id}`)).send({ name: "Thin wall finish" }).expect(200)).body);
    expect(renamed).toMatchObject({ revision: 4, name: "Thin wall finish", notes: "Use the soft jaws" });

    const list = recipeRevisionListSchema.parse((await people.programmer.agent.get(url(`/${recipe.id}/revisions`)).expect(200)).body).items;
    expect(list.map((r) => r.revision)).toEqual([4, 3, 2, 1]);
    expect(list[2]).toMatchObject({ changeNote: "Shallower for the thin wall", authorName: "Test r-prog", changes: ["axial depth 3 mm → 2 mm"] });
    expect(list[1]).toMatchObject({ changeNote: "Edited", changes: ["notes edited"] });
    expect(list[0]).toMatchObject({ authorId: people.owner.userId, changes: ["name “Pocket wall finish” → “Thin wall finish”"] });
    expect(Date.parse(list[0]!.createdAt)).toBeGreaterThanOrEqual(Date.parse(list[3]!.createdAt));
  });

  it("writes nothing for an edit that changes nothing", async () => {
    const recipe = await create();
    const same = recipeSchema.parse((await people.programmer.agent.patch(url(`/${recipe.id}`)).send({ params, name: recipe.name }).expect(200)).body);
    expect(same.revision).toBe(1);
  });

  it("restores an old revision as a new revision, recomputed", async () => {
    const recipe = await create();
    await people.programmer.agent.patch(url(`/${recipe.id}`)).send({ params: { ...params, radialDepthMm: 0.5 }, name: "Lighter" }).expect(200);
    const restored = recipeSchema.parse((await people.programmer.agent.post(url(`/${recipe.id}/restore`)).send({ revision: 1 }).expect(200)).body);
    expect(restored).toMatchObject({ revision: 3, name: recipe.name, params: recipe.params });
    expect(restored.result).toEqual(recipe.result);
    const latest = recipeRevisionListSchema.parse((await people.programmer.agent.get(url(`/${recipe.id}/revisions`))).body).items[0]!;
    expect(latest).toMatchObject({ revision: 3, changeNote: "Restored revision 1" });
    expect(latest.changes).toEqual(expect.arrayContaining(["name “Lighter” → “Pocket wall finish”", "radial depth 0.5 mm → 1.5 mm"]));

    // Restoring the state it is already in, or a revision that does not exist, is refused.
    expect((await people.programmer.agent.post(url(`/${recipe.id}/restore`)).send({ revision: 3 })).status).toBe(409);
    const missing = await people.programmer.agent.post(url(`/${recipe.id}/restore`)).send({ revision: 9 });
    expect(missing.status).toBe(400);
    expect(apiErrorSchema.parse(missing.body).error.fields).toEqual({ revision: "This recipe has no revision 9." });
    expect((await people.programmer.agent.post(url(`/${recipe.id}/restore`)).send({ revision: 0 })).status).toBe(400);
  });

  it("refuses edits and restores by operators (403) and answers 404 for unknown recipes", async () => {
    const recipe = await create();
    expect((await people.operator.agent.patch(url(`/${recipe.id}`)).send({ name: "x" })).status).toBe(403);
    expect((await people.operator.agent.post(url(`/${recipe.id}/restore`)).send({ revision: 1 })).status).toBe(403);
    expect((await people.programmer.agent.patch(url(`/${randomUUID()}`)).send({ name: "x" })).status).toBe(404);
  });

  it("answers 400 for a bad edit body", async () => {
    const recipe = await create();
    const res = await people.programmer.agent.patch(url(`/${recipe.id}`)).send({ params: { axialDepthMm: 0 }, name: "" });
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {})).toEqual(expect.arrayContaining(["params.axialDepthMm", "name"]));
  });
});

describe("DELETE recipes/:id and restore-deleted", () => {
  it("moves a recipe to the bin and back", async () => {
    const recipe = await create({ name: "Binned pocket" });
    await people.programmer.agent.delete(url(`/${recipe.id}`)).expect(204);
    expect((await people.programmer.agent.get(url(`/${recipe.id}`))).status).toBe(404);
    const bin = recipePageSchema.parse((await people.programmer.agent.get(url("?deleted=true&q=Binned"))).body);
    expect(bin.items.map((r) => r.id)).toEqual([recipe.id]);
    expect(bin.items[0]!.deletedAt).not.toBeNull();
    const live = recipePageSchema.parse((await people.programmer.agent.get(url("?q=Binned"))).body);
    expect(live.items).toEqual([]);

    const back = recipeSchema.parse((await people.programmer.agent.post(url(`/${recipe.id}/restore-deleted`)).expect(200)).body);
    expect(back.deletedAt).toBeNull();
    expect((await people.programmer.agent.post(url(`/${recipe.id}/restore-deleted`))).status).toBe(409);
    expect((await people.programmer.agent.delete(url(`/${randomUUID()}`))).status).toBe(404);
  });

  it("keeps operators out of deleting and of the bin", async () => {
    const recipe = await create();
    expect((await people.operator.agent.delete(url(`/${recipe.id}`))).status).toBe(403);
    expect((await people.operator.agent.get(url("?deleted=true"))).status).toBe(403);
  });
});

describe("POST recipes/:id/copy", () => {
  it("copies to another machine's assembly as a draft recomputed against that machine", async () => {
    const recipe = await create({ name: "Slot 6 mm" });
    const res = await people.programmer.agent.post(url(`/${recipe.id}/copy`)).send({ assemblyId: lib.millAssemblyId });
    expect(res.status).toBe(201);
    const copy = recipeSchema.parse(res.body);
    expect(copy).toMatchObject({ status: "draft", revision: 1, machineId: lib.millId, name: "Slot 6 mm (Test bench mill)", params: recipe.params });
    expect(copy.id).not.toBe(recipe.id);
    expect(copy.result).toEqual(await expectedSummary(lib.millAssemblyId, lib.aluminiumId, "profile", params));
    // The mill's spindle tops out at 6000 rpm: the copy is bound by it, the router recipe was not.
    expect(copy.result.rpm).toBeLessThanOrEqual(6000);
    expect(copy.result.rpm).not.toBe(recipe.result.rpm);
    const rev = recipeRevisionListSchema.parse((await people.programmer.agent.get(url(`/${copy.id}/revisions`))).body).items[0]!;
    expect(rev.changeNote).toMatch(/^Copied from “Slot 6 mm” revision 1 \(Test gantry router\); recomputed for Test bench mill, not yet proven there$/);
  });

  it("refuses an assembly of another shop (400) and operators (403)", async () => {
    const recipe = await create();
    const res = await people.programmer.agent.post(url(`/${recipe.id}/copy`)).send({ assemblyId: outsiderLib.millAssemblyId });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields?.assemblyId).toBeDefined();
    expect((await people.operator.agent.post(url(`/${recipe.id}/copy`)).send({ assemblyId: lib.millAssemblyId })).status).toBe(403);
    expect((await people.programmer.agent.post(url(`/${recipe.id}/copy`)).send({})).status).toBe(400);
  });
});
