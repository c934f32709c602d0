import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  machineBodySchema,
  machineDefaultsSchema,
  machineKinds,
  machinePageSchema,
  machineSchema,
  type Machine,
} from "@ringdown/contracts";
import { createPerson, disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import { cutterBody, globalMaterialId, insertRecipeRow, machineBody, needsRecheck, teamShop, type Team } from "./library-test-fixtures.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let team: Team;
let other: Team;
const base = () => `/api/shops/${team.shopId}/machines`;

beforeAll(async () => {
  team = await teamShop(app, "mach");
  other = await teamShop(app, "mach-other");
});

async function create(overrides: Record<string, unknown> = {}): Promise<Machine> {
  const res = await team.owner.agent.post(base()).send(machineBody(overrides));
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return machineSchema.parse(res.body);
}

describe("GET /machines/defaults", () => {
  it.each(machineKinds)("gives a complete, valid %s that can be saved, every default listed as an estimate", async (kind) => {
    const res = await team.operator.agent.get(`${base()}/defaults`).query({ kind });
    expect(res.status).toBe(200);
    const defaults = machineDefaultsSchema.parse(res.body);
    expect(defaults.kind).toBe(kind);
    expect(machineBodySchema.safeParse(defaults).success).toBe(true);
    // Every numeric leaf and every mode is an estimate; the name is not.
    for (const axis of ["x", "y", "z"]) {
      for (const field of ["drive", "travelMm", "maxFeedMmPerMin", "stiffnessNPerMm", "backlashMm"]) {
        expect(defaults.estimatedFields).toContain(`axes.${axis}.${field}`);
      }
    }
    expect(defaults.estimatedFields).toEqual(expect.arrayContaining(["spindle.minRpm", "spindle.maxRpm", "spindle.powerW", "deflectionCeilingMm"]));
    expect(defaults.estimatedFields).toEqual(expect.arrayContaining(defaults.modes.map((_, i) => `modes.${i}`)));
    expect(defaults.estimatedFields).not.toContain("name");
    expect(defaults.modes.every((m) => m.source === "estimated")).toBe(true);

    const saved = await team.tooling_manager.agent.post(base()).send(defaults);
    expect(saved.status).toBe(201);
    expect(machineSchema.parse(saved.body).estimatedFields).toEqual(defaults.estimatedFields);
  });

  it("makes a gantry router soft, on belts, with a low gantry mode; a bench mill stiff, on ball screws", async () => {
    const router = machineDefaultsSchema.parse((await team.operator.agent.get(`${base()}/defaults`).query({ kind: "gantry_router" })).body);
    expect([router.axes.x.drive, router.axes.y.drive]).toEqual(["belt", "belt"]);
    for (const a of ["x", "y", "z"] as const) expect(router.axes[a].stiffnessNPerMm).toBeLessThan(1000);
    // domain-reference BELT-3: 2 belt spans of c_sp = 30 000 N over 1 m → 240 000 N/m; 10 kg moving:
    // fn = √(240000/10)/(2π) = 24.656 Hz.
    const low = router.modes[0]!;
    expect(low.frequencyHz).toBeCloseTo(Math.sqrt(240000 / 10) / (2 * Math.PI), 2);
    expect(low.stiffnessNPerMm).toBe(240);

    const mill = machineDefaultsSchema.parse((await team.operator.agent.get(`${base()}/defaults`).query({ kind: "bench_mill" })).body);
    for (const a of ["x", "y", "z"] as const) {
      expect(mill.axes[a].drive).toBe("ball_screw");
      expect(mill.axes[a].stiffnessNPerMm).toBeGreaterThanOrEqual(3000);
      expect(mill.axes[a].stiffnessNPerMm).toBeGreaterThan(router.axes[a].stiffnessNPerMm);
    }
    expect(mill.modes[0]!.frequencyHz).toBeGreaterThan(router.modes[0]!.frequencyHz);
  });

  it("answers 400 for a missing or unknown kind", async () => {
    const res = await team.operator.agent.get(`${base()}/defaults`).query({ kind: "lathe" });
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {})).toEqual(["query.kind"]);
    expect((await team.operator.agent.get(`${base()}/defaults`)).status).toBe(400);
  });
});

describe("POST, GET /machines", () => {
  it("lets tooling managers and owners add machines; programmers and operators get 403", async () => {
    expect((await team.tooling_manager.agent.post(base()).send(machineBody({ name: "By the tooling manager" }))).status).toBe(201);
    for (const role of ["programmer", "operator"] as const) {
      const res = await team[role].agent.post(base()).send(machineBody());
      expect(res.status, role).toBe(403);
    }
  });

  it("answers 400 with nested field paths", async () => {
    const body = machineBody({
      spindle: { minRpm: 20000, maxRpm: 10000, powerW: 1500 },
      modes: [{ direction: "w", frequencyHz: 25, dampingRatio: 0.9, stiffnessNPerMm: 250 }],
    });
    (body.axes as { x: { stiffnessNPerMm: number } }).x.stiffnessNPerMm = -5;
    const res = await team.owner.agent.post(base()).send(body);
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({
      "axes.x.stiffnessNPerMm": "stiffness must be more than 0",
      "modes.0.direction": expect.any(String),
      "modes.0.dampingRatio": "damping ratio must be at most 0.5",
    });
    const order = await team.owner.agent.post(base()).send(machineBody({ spindle: { minRpm: 20000, maxRpm: 10000, powerW: 1500 } }));
    expect(apiErrorSchema.parse(order.body).error.fields).toEqual({ "spindle.maxRpm": "Maximum rpm must not be below minimum rpm" });
  });

  it("returns the machine with its modes, sorted by direction and frequency; lists filter by kind and text", async () => {
    const m = await create({
      name: "Listed mill",
      kind: "bench_mill",
      modes: [
        { direction: "y", frequencyHz: 440, dampingRatio: 0.04, stiffnessNPerMm: 6000, source: "measured" },
        { direction: "x", frequencyHz: 900, dampingRatio: 0.03, stiffnessNPerMm: 9000 },
        { direction: "x", frequencyHz: 450, dampingRatio: 0.04, stiffnessNPerMm: 8000, note: "column" },
      ],
    });
    const got = machineSchema.parse((await team.operator.agent.get(`${base()}/${m.id}`)).body);
    expect(got.modes.map((x) => [x.direction, x.frequencyHz, x.source])).toEqual([
      ["x", 450, "manual"],
      ["x", 900, "manual"],
      ["y", 440, "measured"],
    ]);
    expect(got.spindle).toEqual({ minRpm: 8000, maxRpm: 24000, powerW: 1500, powerCurve: [], dialSettings: [] });

    const mills = machinePageSchema.parse((await team.operator.agent.get(base()).query({ kind: "bench_mill" })).body);
    expect(mills.items.map((x) => x.id)).toContain(m.id);
    expect(mills.items.every((x) => x.kind === "bench_mill")).toBe(true);
    const text = machinePageSchema.parse((await team.operator.agent.get(base()).query({ q: "listed" })).body);
    expect(text.items.map((x) => x.id)).toEqual([m.id]);
    expect(text.items[0]!.modes).toHaveLength(3);

    expect((await other.owner.agent.get(`/api/shops/${other.shopId}/machines/${m.id}`)).status).toBe(404);
    const foreignList = machinePageSchema.parse((await other.owner.agent.get(`/api/shops/${other.shopId}/machines`)).body);
    expect(foreignList.items).toEqual([]);
  });
});

describe("PATCH /machines/:id", () => {
  it("keeps an unchanged mode's date and estimate mass when the mode set is sent back with one more mode", async () => {
    const { getSequelize } = await import("../../db/sequelize.js");
    const m = await create({ name: "Mode keeper" });
    await getSequelize().query(`UPDATE machine_modes SET mass_kg = 17, measured_at = '2026-01-05T10:00:00Z' WHERE machine_id = :id`, { replacements: { id: m.id } });
    const res = await team.tooling_manager.agent.patch(`${base()}/${m.id}`).send({
      modes: [...m.modes, { direction: "x", frequencyHz: 702, dampingRatio: 0.025, stiffnessNPerMm: 1900, source: "measured", note: "" }],
    });
    expect(res.status).toBe(200);
    const [rows] = await getSequelize().query(`SELECT frequency_hz, mass_kg, measured_at FROM machine_modes WHERE machine_id = :id ORDER BY frequency_hz`, {
      replacements: { id: m.id },
    });
    const kept = rows as Array<{ frequency_hz: number; mass_kg: number | null; measured_at: Date }>;
    expect(kept).toHaveLength(m.modes.length + 1);
    for (const row of kept.filter((r) => m.modes.some((x) => x.frequencyHz === r.frequency_hz))) {
      expect(row.mass_kg).toBe(17);
      expect(new Date(row.measured_at).toISOString()).toBe("2026-01-05T10:00:00.000Z");
    }
    expect(kept.find((r) => r.frequency_hz === 702)!.mass_kg).toBeNull();
  });

  it("replaces the whole mode set when modes are sent and leaves them alone otherwise", async () => {
    const m = await create({ name: "Mode swap" });
    const renamed = machineSchema.parse((await team.tooling_manager.agent.patch(`${base()}/${m.id}`).send({ name: "Mode swap 2" })).body);
    expect(renamed.modes).toEqual(m.modes);
    expect(renamed.axes).toEqual(m.axes);

    const res = await team.tooling_manager.agent.patch(`${base()}/${m.id}`).send({
      modes: [
        { direction: "x", frequencyHz: 23.8, dampingRatio: 0.035, stiffnessNPerMm: 540, source: "measured", note: "tap test" },
        { direction: "x", frequencyHz: 702, dampingRatio: 0.025, stiffnessNPerMm: 1900, source: "measured" },
      ],
    });
    expect(res.status).toBe(200);
    const swapped = machineSchema.parse(res.body);
    expect(swapped.modes.map((x) => x.frequencyHz)).toEqual([23.8, 702]);
    expect(swapped.name).toBe("Mode swap 2");
    expect(Date.parse(swapped.updatedAt)).toBeGreaterThanOrEqual(Date.parse(m.updatedAt));

    const cleared = machineSchema.parse((await team.owner.agent.patch(`${base()}/${m.id}`).send({ modes: [] })).body);
    expect(cleared.modes).toEqual([]);
  });

  it("drops a field from the estimates once someone enters its value, unless estimates are sent too", async () => {
    const defaults = machineDefaultsSchema.parse((await team.owner.agent.get(`${base()}/defaults`).query({ kind: "gantry_router" })).body);
    const m = machineSchema.parse((await team.owner.agent.post(base()).send({ ...defaults, name: "Measured later" })).body);
    const measured = await team.owner.agent.patch(`${base()}/${m.id}`).send({
      axes: { ...m.axes, y: { ...m.axes.y, stiffnessNPerMm: 260 } },
      modes: [{ ...m.modes[0]!, frequencyHz: 23.9, source: "measured" }],
    });
    const after = machineSchema.parse(measured.body).estimatedFields;
    expect(after).not.toContain("axes.y.stiffnessNPerMm");
    expect(after).not.toContain("modes.0");
    expect(after).toContain("axes.x.stiffnessNPerMm");
    expect(after).toHaveLength(m.estimatedFields.length - 2);

    const explicit = await team.owner.agent.patch(`${base()}/${m.id}`).send({ axes: { ...m.axes, x: { ...m.axes.x, travelMm: 900 } }, estimatedFields: ["axes.x.travelMm"] });
    expect(machineSchema.parse(explicit.body).estimatedFields).toEqual(["axes.x.travelMm"]);
  });

  it("changes nothing when any part of the patch is invalid", async () => {
    const m = await create({ name: "Atomic" });
    const res = await team.owner.agent.patch(`${base()}/${m.id}`).send({
      name: "Should not stick",
      modes: [{ direction: "x", frequencyHz: 30, dampingRatio: 0.03, stiffnessNPerMm: 300 }],
      spindle: { minRpm: 30000, maxRpm: 1000, powerW: 100 },
    });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ "spindle.maxRpm": "Maximum rpm must not be below minimum rpm" });
    const after = machineSchema.parse((await team.owner.agent.get(`${base()}/${m.id}`)).body);
    expect(after.name).toBe("Atomic");
    expect(after.modes).toEqual(m.modes);
  });

  it("is for tooling managers and owners only", async () => {
    const m = await create();
    expect((await team.programmer.agent.patch(`${base()}/${m.id}`).send({ name: "x" })).status).toBe(403);
    expect((await team.operator.agent.patch(`${base()}/${m.id}`).send({ name: "x" })).status).toBe(403);
    expect((await team.owner.agent.patch(`${base()}/${randomUUID()}`).send({ name: "x" })).status).toBe(404);
  });
});

describe("DELETE /machines/:id and restore", () => {
  it("refuses while assemblies or recipes are on the machine; flags recipes when limits change", async () => {
    const m = await create({ name: "Busy machine" });
    const cutter = (await team.owner.agent.post(`/api/shops/${team.shopId}/cutters`).send(cutterBody())).body as { id: string };
    const assembly = (
      await team.owner.agent
        .post(`/api/shops/${team.shopId}/assemblies`)
        .send({ machineId: m.id, cutterId: cutter.id, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 })
    ).body as { id: string };
    const recipeId = await insertRecipeRow({
      shopId: team.shopId,
      assemblyId: assembly.id,
      machineId: m.id,
      cutterId: cutter.id,
      materialId: await globalMaterialId("hdpe"),
      authorId: team.owner.userId,
    });
    const res = await team.owner.agent.delete(`${base()}/${m.id}`);
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error.message).toBe(
      "This machine has 1 cutter assembly and 1 recipe; delete or move those before deleting the machine.",
    );

    await team.owner.agent.patch(`${base()}/${m.id}`).send({ notes: "oiled the rails" }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(false);
    await team.owner.agent.patch(`${base()}/${m.id}`).send({ modes: [] }).expect(200);
    expect(await needsRecheck(recipeId)).toBe(true);
  });

  it("moves an unused machine to the bin and back", async () => {
    const m = await create({ name: "Sold machine" });
    expect((await team.programmer.agent.delete(`${base()}/${m.id}`)).status).toBe(403);
    expect((await team.tooling_manager.agent.delete(`${base()}/${m.id}`)).status).toBe(204);
    expect((await team.owner.agent.get(`${base()}/${m.id}`)).status).toBe(200);
    const list = machinePageSchema.parse((await team.owner.agent.get(base()).query({ pageSize: 200 })).body);
    expect(list.items.map((x) => x.id)).not.toContain(m.id);
    const bin = machinePageSchema.parse((await team.owner.agent.get(base()).query({ deleted: "true" })).body);
    expect(bin.items.map((x) => x.id)).toEqual([m.id]);
    expect((await team.owner.agent.patch(`${base()}/${m.id}`).send({ name: "x" })).status).toBe(409);

    expect((await team.programmer.agent.post(`${base()}/${m.id}/restore`)).status).toBe(403);
    const restored = machineSchema.parse((await team.tooling_manager.agent.post(`${base()}/${m.id}/restore`)).body);
    expect(restored.deletedAt).toBeNull();
    expect(restored.modes).toEqual(m.modes);
  });
});

describe("POST /machines on the free plan", () => {
  it("allows one machine and refuses the second with a message that says how to add more", async () => {
    // A new shop that never subscribed is on the free plan (1 machine).
    const owner = await createPerson(app, "free-plan-machines", "Free plan machine shop");
    const first = await owner.agent.post(`/api/shops/${owner.shopId}/machines`).send(machineBody());
    expect(first.status).toBe(201);
    const second = await owner.agent.post(`/api/shops/${owner.shopId}/machines`).send(machineBody({ name: "Second machine" }));
    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/free plan includes 1 machine/i);
    const list = await owner.agent.get(`/api/shops/${owner.shopId}/machines`);
    expect(list.body.total).toBe(1);
  });

  it("counts a restored machine against the plan like a new one", async () => {
    const owner = await createPerson(app, "free-plan-restore", "Free plan restore shop");
    const first = await owner.agent.post(`/api/shops/${owner.shopId}/machines`).send(machineBody());
    expect((await owner.agent.delete(`/api/shops/${owner.shopId}/machines/${first.body.id}`)).status).toBe(204);
    expect((await owner.agent.post(`/api/shops/${owner.shopId}/machines`).send(machineBody({ name: "Replacement" }))).status).toBe(201);
    const restore = await owner.agent.post(`/api/shops/${owner.shopId}/machines/${first.body.id}/restore`);
    expect(restore.status).toBe(409);
    expect(restore.body.error.message).toMatch(/free plan includes 1 machine/i);
    const list = await owner.agent.get(`/api/shops/${owner.shopId}/machines`);
    expect(list.body.total).toBe(1);
  });
});
