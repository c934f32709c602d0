import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, materialPageSchema, materialSchema } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { globalMaterials } from "../../seed/global-materials.js";
import { disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import {
  cutterBody,
  globalMaterialId,
  insertRecipeRow,
  machineBody,
  materialBody,
  needsRecheck,
  teamShop,
  type Team,
} from "../machines/library-test-fixtures.js";
import { syncGlobalMaterials } from "./global-materials.sync.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let team: Team;
let other: Team;
const base = () => `/api/shops/${team.shopId}/materials`;

beforeAll(async () => {
  team = await teamShop(app, "mat");
  other = await teamShop(app, "mat-other");
});

describe("global materials", () => {
  it("are loaded into every database by migrate(), read-only, one row per key", async () => {
    const res = await team.operator.agent.get(base()).query({ scope: "global", pageSize: 200 });
    expect(res.status).toBe(200);
    const page = materialPageSchema.parse(res.body);
    expect(page.total).toBe(globalMaterials.length);
    expect(page.items.every((m) => m.readOnly && m.shopId === null)).toBe(true);
    expect(page.items.map((m) => m.name).sort()).toEqual(globalMaterials.map((m) => m.name).sort());
  });

  it("upserts by key: a second sync changes nothing; a tampered row is put back", async () => {
    expect(await syncGlobalMaterials(getSequelize())).toBe(0);
    const id = await globalMaterialId("al-6061-t6");
    await getSequelize().query("UPDATE materials SET kc11_n_per_mm2 = 1, name = 'tampered' WHERE id = $1", { bind: [id] });
    expect(await syncGlobalMaterials(getSequelize())).toBe(1);
    const restored = materialSchema.parse((await team.operator.agent.get(`${base()}/${id}`)).body);
    const seed = globalMaterials.find((m) => m.key === "al-6061-t6")!;
    expect(restored.name).toBe(seed.name);
    expect(restored.kc11NPerMm2).toBe(seed.kc11NPerMm2);
  });

  it("refuses PATCH and DELETE on a global row with 403 and says to copy it", async () => {
    const id = await globalMaterialId("mdf");
    const patch = await team.owner.agent.patch(`${base()}/${id}`).send({ name: "Our MDF" });
    expect(patch.status).toBe(403);
    expect(apiErrorSchema.parse(patch.body).error.message).toMatch(/read-only.*Copy it into your shop/);
    const del = await team.tooling_manager.agent.delete(`${base()}/${id}`);
    expect(del.status).toBe(403);
    const after = materialSchema.parse((await team.owner.agent.get(`${base()}/${id}`)).body);
    expect(after.name).not.toBe("Our MDF");
    expect(after.deletedAt).toBeNull();
  });
});

describe("listing", () => {
  let ownId: string;
  beforeAll(async () => {
    const res = await team.owner.agent.post(base()).send(materialBody({ name: "Listing walnut 50%_off" }));
    ownId = materialSchema.parse(res.body).id;
  });

  it("shows global rows and the shop's own, filtered by group and text (% and _ are literal)", async () => {
    const all = materialPageSchema.parse((await team.operator.agent.get(base()).query({ pageSize: 200 })).body);
    expect(all.total).toBe(globalMaterials.length + 1);
    expect(all.items.some((m) => m.id === ownId && !m.readOnly)).toBe(true);

    const alu = materialPageSchema.parse((await team.operator.agent.get(base()).query({ group: "aluminium" })).body);
    expect(alu.items.length).toBeGreaterThan(0);
    expect(alu.items.every((m) => m.group === "aluminium")).toBe(true);

    const q = materialPageSchema.parse((await team.operator.agent.get(base()).query({ q: "50%_o" })).body);
    expect(q.items.map((m) => m.id)).toEqual([ownId]);
    // As wildcards "%_" would match every name of two characters or more.
    const literal = materialPageSchema.parse((await team.operator.agent.get(base()).query({ q: "%_" })).body);
    expect(literal.items.map((m) => m.id)).toEqual([ownId]);

    const shopOnly = materialPageSchema.parse((await team.operator.agent.get(base()).query({ scope: "shop" })).body);
    expect(shopOnly.items.map((m) => m.id)).toEqual([ownId]);
  });

  it("pages the list and validates the query with field paths", async () => {
    const page2 = materialPageSchema.parse((await team.operator.agent.get(base()).query({ page: 2, pageSize: 5 })).body);
    expect(page2).toMatchObject({ page: 2, pageSize: 5 });
    expect(page2.items).toHaveLength(5);
    const bad = await team.operator.agent.get(base()).query({ group: "unobtainium", pageSize: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {}).sort()).toEqual(["query.group", "query.pageSize"]);
  });

  it("never shows another shop's rows, and a foreign id is 404", async () => {
    const foreign = materialPageSchema.parse((await other.owner.agent.get(`/api/shops/${other.shopId}/materials`).query({ scope: "shop" })).body);
    expect(foreign.items).toEqual([]);
    const res = await other.owner.agent.get(`/api/shops/${other.shopId}/materials/${ownId}`);
    expect(res.status).toBe(404);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("Material not found.");
    expect((await team.owner.agent.get(`${base()}/not-a-uuid`)).status).toBe(404);
  });
});

describe("creating, copying, editing", () => {
  it("lets tooling managers and owners create; programmers and operators get 403", async () => {
    for (const role of ["tooling_manager", "owner"] as const) {
      const res = await team[role].agent.post(base()).send(materialBody({ name: `Made by ${role}` }));
      expect(res.status, role).toBe(201);
      expect(materialSchema.parse(res.body)).toMatchObject({ shopId: team.shopId, readOnly: false, copiedFromId: null, hardness: "" });
    }
    for (const role of ["programmer", "operator"] as const) {
      const res = await team[role].agent.post(base()).send(materialBody());
      expect(res.status, role).toBe(403);
      expect(apiErrorSchema.parse(res.body).error.message).toBe("Only an owner or tooling manager of this shop can do this.");
    }
  });

  it("answers 400 with field paths for an invalid body", async () => {
    const res = await team.owner.agent.post(base()).send(
      materialBody({ name: "x", chipLoad: [{ diameterMm: 6, minMm: 0.2, maxMm: 0.1 }], group: "cheese" }),
    );
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({
      name: "Enter a name",
      group: expect.any(String),
      "chipLoad.0.maxMm": "Maximum must not be below minimum",
    });
  });

  it("copies a global row into the shop, which can then be adjusted; the global row is unchanged", async () => {
    const globalId = await globalMaterialId("plywood-birch");
    const copyRes = await team.tooling_manager.agent.post(`${base()}/${globalId}/copy`).send({});
    expect(copyRes.status).toBe(201);
    const copy = materialSchema.parse(copyRes.body);
    const original = materialSchema.parse((await team.owner.agent.get(`${base()}/${globalId}`)).body);
    expect(copy).toMatchObject({
      shopId: team.shopId,
      readOnly: false,
      copiedFromId: globalId,
      name: `${original.name} (shop copy)`,
      chipLoad: original.chipLoad,
      sourceNote: original.sourceNote,
    });

    const patched = await team.tooling_manager.agent.patch(`${base()}/${copy.id}`).send({ minChipThicknessMm: 0.07 });
    expect(patched.status).toBe(200);
    // Only the field sent changes; the rest (name, hardness…) stays as it was.
    expect(materialSchema.parse(patched.body)).toMatchObject({
      minChipThicknessMm: 0.07,
      name: copy.name,
      hardness: original.hardness,
    });
    const again = materialSchema.parse((await team.owner.agent.get(`${base()}/${globalId}`)).body);
    expect(again.minChipThicknessMm).toBe(original.minChipThicknessMm);

    const named = await team.owner.agent.post(`${base()}/${globalId}/copy`).send({ name: "Birch ply, our stock" });
    expect(materialSchema.parse(named.body).name).toBe("Birch ply, our stock");
    expect((await team.programmer.agent.post(`${base()}/${globalId}/copy`).send({})).status).toBe(403);
  });

  it("validates a PATCH against the merged material and keeps field paths", async () => {
    const created = materialSchema.parse((await team.owner.agent.post(base()).send(materialBody({ name: "Patch target" }))).body);
    const res = await team.owner.agent
      .patch(`${base()}/${created.id}`)
      .send({ cuttingSpeed: { carbide: { minMPerMin: 500, maxMPerMin: 100 }, hss: { minMPerMin: 50, maxMPerMin: 60 } } });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ "cuttingSpeed.carbide.maxMPerMin": "Maximum must not be below minimum" });
    expect((await team.programmer.agent.patch(`${base()}/${created.id}`).send({ name: "Nope" })).status).toBe(403);
  });
});

describe("deleting", () => {
  it("refuses with 409 while a recipe uses the material; otherwise soft-deletes and restores", async () => {
    const mat = materialSchema.parse((await team.owner.agent.post(base()).send(materialBody({ name: "Used walnut" }))).body);
    const machine = (await team.owner.agent.post(`/api/shops/${team.shopId}/machines`).send(machineBody())).body as { id: string };
    const cutter = (await team.owner.agent.post(`/api/shops/${team.shopId}/cutters`).send(cutterBody())).body as { id: string };
    const assembly = (
      await team.owner.agent
        .post(`/api/shops/${team.shopId}/assemblies`)
        .send({ machineId: machine.id, cutterId: cutter.id, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 })
    ).body as { id: string };
    const recipeId = await insertRecipeRow({
      shopId: team.shopId,
      assemblyId: assembly.id,
      machineId: machine.id,
      cutterId: cutter.id,
      materialId: mat.id,
      authorId: team.owner.userId,
    });

    const refused = await team.owner.agent.delete(`${base()}/${mat.id}`);
    expect(refused.status).toBe(409);
    expect(apiErrorSchema.parse(refused.body).error.message).toBe(
      "This material is used by 1 recipe; it cannot be deleted while they use it.",
    );

    // Changing its numbers asks the recipe for a re-check; renaming alone does not.
    await team.owner.agent.patch(`${base()}/${mat.id}`).send({ name: "Used walnut, renamed" }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(false);
    await team.owner.agent.patch(`${base()}/${mat.id}`).send({ unitPowerJPerMm3: 0.09 }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(true);

    const free = materialSchema.parse((await team.owner.agent.post(base()).send(materialBody({ name: "Spare walnut" }))).body);
    expect((await team.operator.agent.delete(`${base()}/${free.id}`)).status).toBe(403);
    expect((await team.tooling_manager.agent.delete(`${base()}/${free.id}`)).status).toBe(204);
    const listed = materialPageSchema.parse((await team.owner.agent.get(base()).query({ scope: "shop", pageSize: 200 })).body);
    expect(listed.items.map((m) => m.id)).not.toContain(free.id);
    const bin = materialPageSchema.parse((await team.owner.agent.get(base()).query({ deleted: "true" })).body);
    expect(bin.items.map((m) => m.id)).toEqual([free.id]);
    expect(bin.items[0]!.deletedAt).not.toBeNull();

    const restored = await team.tooling_manager.agent.post(`${base()}/${free.id}/restore`);
    expect(restored.status).toBe(200);
    expect(materialSchema.parse(restored.body).deletedAt).toBeNull();
    expect((await team.owner.agent.post(`${base()}/${randomUUID()}/restore`)).status).toBe(404);
  });
});
