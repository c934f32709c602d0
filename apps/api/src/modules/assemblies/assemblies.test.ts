import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, assemblyPageSchema, assemblySchema, cutterSchema, machineSchema, type Assembly } from "@ringdown/contracts";
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
let machineId: string;
let millId: string;
let cutterId: string;
let retiredCutterId: string;
let foreignMachineId: string;
let foreignCutterId: string;
const base = () => `/api/shops/${team.shopId}/assemblies`;

beforeAll(async () => {
  team = await teamShop(app, "asm");
  other = await teamShop(app, "asm-other");
  const post = async (t: Team, path: string, body: object) => {
    const res = await t.owner.agent.post(`/api/shops/${t.shopId}/${path}`).send(body);
    if (res.status !== 201) throw new Error(`${path}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as { id: string };
  };
  machineId = machineSchema.parse(await post(team, "machines", machineBody({ name: "Asm router" }))).id;
  millId = machineSchema.parse(await post(team, "machines", machineBody({ name: "Asm mill", kind: "bench_mill" }))).id;
  cutterId = cutterSchema.parse(await post(team, "cutters", cutterBody({ name: "Asm 6 mm", status: "approved" }))).id;
  retiredCutterId = cutterSchema.parse(await post(team, "cutters", cutterBody({ name: "Asm old", status: "approved" }))).id;
  await team.owner.agent.post(`/api/shops/${team.shopId}/cutters/${retiredCutterId}/transition`).send({ to: "retired" }).expect(200);
  foreignMachineId = (await post(other, "machines", machineBody())).id;
  foreignCutterId = (await post(other, "cutters", cutterBody())).id;
});

const body = (overrides: Record<string, unknown> = {}) => ({
  machineId,
  cutterId,
  holder: "ER20 collet, 6 mm",
  stickoutMm: 20,
  runoutMm: 0.01,
  ...overrides,
});

async function create(overrides: Record<string, unknown> = {}): Promise<Assembly> {
  const res = await team.programmer.agent.post(base()).send(body(overrides));
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return assemblySchema.parse(res.body);
}

describe("POST /assemblies", () => {
  it("lets programmers and up add an assembly, returned with machine and cutter names", async () => {
    const a = await create({ notes: "poor collet", runoutMm: 0.08 });
    expect(a).toMatchObject({
      shopId: team.shopId,
      machineName: "Asm router",
      cutterName: "Asm 6 mm",
      cutterStatus: "approved",
      cutterDiameterMm: 6,
      runoutMm: 0.08,
      notes: "poor collet",
      deletedAt: null,
    });
    expect((await team.operator.agent.post(base()).send(body())).status).toBe(403);
  });

  it("answers 404 when the machine or cutter is not this shop's", async () => {
    const m = await team.programmer.agent.post(base()).send(body({ machineId: foreignMachineId }));
    expect(m.status).toBe(404);
    expect(apiErrorSchema.parse(m.body).error).toEqual({
      code: "not_found",
      message: "Machine not found.",
      fields: { machineId: "No such machine in this shop" },
    });
    const c = await team.programmer.agent.post(base()).send(body({ cutterId: foreignCutterId }));
    expect(c.status).toBe(404);
    expect(apiErrorSchema.parse(c.body).error.message).toBe("Cutter not found.");
    expect((await team.programmer.agent.post(base()).send(body({ cutterId: randomUUID() }))).status).toBe(404);
  });

  it("refuses a retired cutter with 409", async () => {
    const res = await team.programmer.agent.post(base()).send(body({ cutterId: retiredCutterId }));
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error).toEqual({
      code: "conflict",
      message: "The cutter “Asm old” is retired; choose an approved or proposed cutter.",
      fields: { cutterId: "This cutter is retired" },
    });
  });

  it("answers 400 with field paths", async () => {
    const res = await team.programmer.agent.post(base()).send({ machineId: "nope", cutterId, holder: "", stickoutMm: 0, runoutMm: -0.01 });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({
      machineId: expect.any(String),
      holder: "Name the holder or collet",
      stickoutMm: "stick-out must be more than 0",
      runoutMm: "runout cannot be negative",
    });
  });
});

describe("GET /assemblies", () => {
  it("lists the shop's assemblies, filtered by machine and by cutter", async () => {
    const onMill = await create({ machineId: millId, holder: "ER25 chuck" });
    const all = assemblyPageSchema.parse((await team.operator.agent.get(base()).query({ pageSize: 200 })).body);
    expect(all.items.map((a) => a.id)).toContain(onMill.id);
    const mill = assemblyPageSchema.parse((await team.operator.agent.get(base()).query({ machineId: millId })).body);
    expect(mill.items.map((a) => a.id)).toEqual([onMill.id]);
    const byCutter = assemblyPageSchema.parse((await team.operator.agent.get(base()).query({ cutterId })).body);
    expect(byCutter.items.every((a) => a.cutterId === cutterId)).toBe(true);
    const bad = await team.operator.agent.get(base()).query({ machineId: "x" });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {})).toEqual(["query.machineId"]);

    expect(assemblySchema.parse((await team.operator.agent.get(`${base()}/${onMill.id}`)).body).machineName).toBe("Asm mill");
    expect((await other.owner.agent.get(`/api/shops/${other.shopId}/assemblies/${onMill.id}`)).status).toBe(404);
    const foreign = assemblyPageSchema.parse((await other.owner.agent.get(`/api/shops/${other.shopId}/assemblies`)).body);
    expect(foreign.items).toEqual([]);
  });
});

describe("PATCH /assemblies/:id", () => {
  it("changes the fields sent, checks a new machine or cutter, and flags recipes when numbers change", async () => {
    const a = await create();
    const res = await team.programmer.agent.patch(`${base()}/${a.id}`).send({ runoutMm: 0.005 });
    expect(assemblySchema.parse(res.body)).toMatchObject({ runoutMm: 0.005, stickoutMm: 20, holder: "ER20 collet, 6 mm" });

    expect((await team.programmer.agent.patch(`${base()}/${a.id}`).send({ machineId: foreignMachineId })).status).toBe(404);
    expect((await team.programmer.agent.patch(`${base()}/${a.id}`).send({ cutterId: retiredCutterId })).status).toBe(409);
    const moved = assemblySchema.parse((await team.programmer.agent.patch(`${base()}/${a.id}`).send({ machineId: millId })).body);
    expect(moved.machineName).toBe("Asm mill");
    expect((await team.operator.agent.patch(`${base()}/${a.id}`).send({ notes: "x" })).status).toBe(403);
    const bad = await team.programmer.agent.patch(`${base()}/${a.id}`).send({ stickoutMm: -1 });
    expect(apiErrorSchema.parse(bad.body).error.fields).toEqual({ stickoutMm: "stick-out must be more than 0" });

    const recipeId = await insertRecipeRow({
      shopId: team.shopId,
      assemblyId: a.id,
      machineId: millId,
      cutterId,
      materialId: await globalMaterialId("al-6061-t6"),
      authorId: team.programmer.userId,
    });
    await team.programmer.agent.patch(`${base()}/${a.id}`).send({ notes: "cleaned the collet" }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(false);
    await team.programmer.agent.patch(`${base()}/${a.id}`).send({ stickoutMm: 25 }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(true);
  });

  it("keeps an assembly whose cutter was retired later editable", async () => {
    const shop = await teamShop(app, "asm-retire-later");
    const m = (await shop.owner.agent.post(`/api/shops/${shop.shopId}/machines`).send(machineBody())).body as { id: string };
    const c = (await shop.owner.agent.post(`/api/shops/${shop.shopId}/cutters`).send(cutterBody({ status: "approved" }))).body as { id: string };
    const a = assemblySchema.parse(
      (await shop.owner.agent.post(`/api/shops/${shop.shopId}/assemblies`).send({ machineId: m.id, cutterId: c.id, holder: "ER20", stickoutMm: 18, runoutMm: 0.01 })).body,
    );
    await shop.owner.agent.post(`/api/shops/${shop.shopId}/cutters/${c.id}/transition`).send({ to: "retired" }).expect(200);
    const res = await shop.owner.agent.patch(`/api/shops/${shop.shopId}/assemblies/${a.id}`).send({ runoutMm: 0.02 });
    expect(res.status).toBe(200);
    expect(assemblySchema.parse(res.body).cutterStatus).toBe("retired");
  });
});

describe("DELETE /assemblies/:id and restore", () => {
  it("refuses while a recipe uses the assembly; otherwise bins and restores it", async () => {
    const used = await create({ holder: "Used holder" });
    await insertRecipeRow({
      shopId: team.shopId,
      assemblyId: used.id,
      machineId,
      cutterId,
      materialId: await globalMaterialId("mdf"),
      authorId: team.programmer.userId,
    });
    const refused = await team.programmer.agent.delete(`${base()}/${used.id}`);
    expect(refused.status).toBe(409);
    expect(apiErrorSchema.parse(refused.body).error.message).toBe("This assembly is used by 1 recipe; retire or move it first.");

    const free = await create({ holder: "Free holder" });
    expect((await team.operator.agent.delete(`${base()}/${free.id}`)).status).toBe(403);
    expect((await team.programmer.agent.delete(`${base()}/${free.id}`)).status).toBe(204);
    expect((await team.programmer.agent.delete(`${base()}/${free.id}`)).status).toBe(404);
    const bin = assemblyPageSchema.parse((await team.operator.agent.get(base()).query({ deleted: "true" })).body);
    expect(bin.items.map((a) => a.id)).toEqual([free.id]);
    expect((await team.programmer.agent.patch(`${base()}/${free.id}`).send({ notes: "x" })).status).toBe(409);
    const restored = await team.programmer.agent.post(`${base()}/${free.id}/restore`);
    expect(restored.status).toBe(200);
    expect(assemblySchema.parse(restored.body).deletedAt).toBeNull();
  });

  it("will not restore an assembly whose cutter is in the bin", async () => {
    const shop = await teamShop(app, "asm-restore");
    const m = (await shop.owner.agent.post(`/api/shops/${shop.shopId}/machines`).send(machineBody())).body as { id: string };
    const c = (await shop.owner.agent.post(`/api/shops/${shop.shopId}/cutters`).send(cutterBody())).body as { id: string };
    const url = `/api/shops/${shop.shopId}/assemblies`;
    const a = assemblySchema.parse((await shop.owner.agent.post(url).send({ machineId: m.id, cutterId: c.id, holder: "ER20", stickoutMm: 18, runoutMm: 0 })).body);
    await shop.owner.agent.delete(`${url}/${a.id}`).expect(204);
    await shop.owner.agent.delete(`/api/shops/${shop.shopId}/cutters/${c.id}`).expect(204);
    const res = await shop.owner.agent.post(`${url}/${a.id}/restore`);
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("Its cutter is deleted; restore that first.");
  });
});
