import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  backlashReadingListSchema,
  backlashReadingMutationSchema,
  ceilingsMutationSchema,
  ceilingsSchema,
  machineModeListSchema,
  machineSchema,
  modeMutationSchema,
  stiffnessMapSchema,
  stiffnessReadingListSchema,
  stiffnessReadingMutationSchema,
  type Machine,
} from "@ringdown/contracts";
import { disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import { cutterBody, globalMaterialId, insertRecipeRow, machineBody, needsRecheck, teamShop, type Team } from "../machines/library-test-fixtures.js";

/*
 * Route tests of a machine's vibration profile over real HTTP and PostgreSQL. Machines, readings
 * and modes are ILLUSTRATIVE test data.
 */

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let team: Team;
beforeAll(async () => {
  team = await teamShop(app, "vib");
});

const shopPath = () => `/api/shops/${team.shopId}`;

/** A machine (600 × 600 × 100 mm envelope: see machineBody) with one recipe on it. */
async function machineWithRecipe(overrides: Record<string, unknown> = {}): Promise<{ machine: Machine; recipeId: string }> {
  const machine = machineSchema.parse((await team.owner.agent.post(`${shopPath()}/machines`).send(machineBody(overrides))).body);
  const cutter = (await team.owner.agent.post(`${shopPath()}/cutters`).send(cutterBody())).body as { id: string };
  const assembly = (
    await team.owner.agent.post(`${shopPath()}/assemblies`).send({ machineId: machine.id, cutterId: cutter.id, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 })
  ).body as { id: string };
  const recipeId = await insertRecipeRow({
    shopId: team.shopId,
    assemblyId: assembly.id,
    machineId: machine.id,
    cutterId: cutter.id,
    materialId: await globalMaterialId("hdpe"),
    authorId: team.owner.userId,
  });
  return { machine, recipeId };
}

async function clearRecheck(recipeId: string): Promise<void> {
  const { getSequelize } = await import("../../db/sequelize.js");
  await getSequelize().query("UPDATE recipes SET needs_recheck = false WHERE id = $1", { bind: [recipeId] });
}

const reading = (over: Record<string, unknown> = {}) => ({ xMm: 300, yMm: 300, zMm: 0, direction: "y", forceN: 50, deflectionMm: 0.2, measuredAt: "2026-03-02", ...over });

describe("stiffness readings", () => {
  it("derives stiffness = F/δ per reading and moves the machine's stiffness to the softest measured position", async () => {
    // machineBody: Y stiffness 300 N/mm, marked as measured (no estimate listed).
    const { machine } = await machineWithRecipe({ estimatedFields: ["axes.y.stiffnessNPerMm"] });
    const base = `${shopPath()}/machines/${machine.id}/stiffness-readings`;
    // 50 N / 0.2 mm = 250 N/mm (hand calculation)
    const first = stiffnessReadingMutationSchema.parse((await team.tooling_manager.agent.post(base).send(reading())).body);
    expect(first.reading.stiffnessNPerMm).toBeCloseTo(250, 9);
    expect(first.machineStiffnessNPerMm.y).toBeCloseTo(250, 9);
    // 50 N / 0.25 mm = 200 N/mm at the beam's mid-span: the worst case becomes 200 N/mm.
    const second = stiffnessReadingMutationSchema.parse((await team.owner.agent.post(base).send(reading({ xMm: 0, deflectionMm: 0.25 }))).body);
    expect(second.machineStiffnessNPerMm.y).toBeCloseTo(200, 9);
    expect(second.changes[0]).toMatchObject({ what: "stiffness", direction: "y", before: 250, unit: "N/mm" });
    expect(second.changes[0]!.changePct).toBeCloseTo(20, 9);

    const after = machineSchema.parse((await team.operator.agent.get(`${shopPath()}/machines/${machine.id}`)).body);
    expect(after.axes.y.stiffnessNPerMm).toBeCloseTo(200, 9);
    expect(after.estimatedFields).not.toContain("axes.y.stiffnessNPerMm");

    const list = stiffnessReadingListSchema.parse((await team.operator.agent.get(base)).body);
    expect(list.items).toHaveLength(2);

    // Deleting the softer reading brings the machine back to 250 N/mm.
    const removed = stiffnessReadingMutationSchema.parse((await team.owner.agent.delete(`${base}/${second.reading.id}`)).body);
    expect(removed.machineStiffnessNPerMm.y).toBeCloseTo(250, 9);
    expect((await team.owner.agent.delete(`${base}/${second.reading.id}`)).status).toBe(404);
  });

  it("recipes take the stiffness at their work position from the readings, or the worst case over a marked region", async () => {
    const machine = machineSchema.parse((await team.owner.agent.post(`${shopPath()}/machines`).send(machineBody())).body);
    const cutter = (await team.owner.agent.post(`${shopPath()}/cutters`).send(cutterBody())).body as { id: string };
    const assembly = (
      await team.owner.agent.post(`${shopPath()}/assemblies`).send({ machineId: machine.id, cutterId: cutter.id, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 })
    ).body as { id: string };
    const base = `${shopPath()}/machines/${machine.id}/stiffness-readings`;
    // Y pushes along the gantry (hand calculation, k = F/δ): 500 N/mm at the ends, 125 N/mm at mid-span.
    for (const [xMm, deflectionMm] of [[0, 0.1], [300, 0.4], [600, 0.1]] as const) {
      expect((await team.owner.agent.post(base).send(reading({ xMm, yMm: 300, deflectionMm }))).status).toBe(201);
    }
    const got = machineSchema.parse((await team.operator.agent.get(`${shopPath()}/machines/${machine.id}`)).body);
    expect(got.stiffnessPoints?.map((p) => [p.xMm, p.direction, Number(p.stiffnessNPerMm.toFixed(6))])).toEqual([
      [0, "y", 500],
      [300, "y", 125],
      [600, "y", 500],
    ]);
    const materialId = await globalMaterialId("hdpe");
    const plan = async (params: Record<string, unknown>) => {
      const res = await team.programmer.agent
        .post(`${shopPath()}/recommendations`)
        .send({ assemblyId: assembly.id, materialId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1, ...params } });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      return res.body.recommendation as { machineStiffnessNPerMm: number; machineDeflectionMm: number; cuttingForceN: number };
    };
    // The engine takes the softer of X (400 N/mm, the machine's axis value) and the map's Y.
    const atEnd = await plan({ workPositionXMm: 0, workPositionYMm: 300 });
    const atMiddle = await plan({ workPositionXMm: 300, workPositionYMm: 300 });
    expect(atEnd.machineStiffnessNPerMm).toBeCloseTo(400, 6);
    expect(atMiddle.machineStiffnessNPerMm).toBeCloseTo(125, 6);
    expect(atMiddle.machineDeflectionMm).toBeCloseTo(atMiddle.cuttingForceN / 125, 9);
    // Region X 0–100 mm: compliance at x = 100 is 2/3 · 1/500 + 1/3 · 1/125 = 0.004 mm/N → 250 N/mm (hand calculation).
    const nearEnd = await plan({ workPositionXMm: 0, workPositionYMm: 300, workRegion: { xMinMm: 0, xMaxMm: 100, yMinMm: 250, yMaxMm: 350 } });
    expect(nearEnd.machineStiffnessNPerMm).toBeCloseTo(250, 6);
    const spanning = await plan({ workPositionXMm: 0, workPositionYMm: 300, workRegion: { xMinMm: 0, xMaxMm: 600, yMinMm: 0, yMaxMm: 600 } });
    expect(spanning.machineStiffnessNPerMm).toBeCloseTo(125, 6);
    const swapped = await team.programmer.agent
      .post(`${shopPath()}/recommendations`)
      .send({ assemblyId: assembly.id, materialId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1, workRegion: { xMinMm: 100, xMaxMm: 0, yMinMm: 0, yMaxMm: 1 } } });
    expect(swapped.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(swapped.body).error.fields ?? {})).toEqual(["params.workRegion.xMaxMm"]);
  });

  it.each([
    [{ forceN: -5 }, "forceN", "Force must be more than 0 N: push with a known load (spring scale or weights)"],
    [{ forceN: 0 }, "forceN", "Force must be more than 0 N: push with a known load (spring scale or weights)"],
    [{ deflectionMm: 0 }, "deflectionMm", "Deflection must be more than 0 mm: a loaded machine always deflects; if the dial did not move, use a larger force"],
    [{ deflectionMm: -0.01 }, "deflectionMm", "Deflection must be more than 0 mm: a loaded machine always deflects; if the dial did not move, use a larger force"],
    [{ xMm: -1 }, "xMm", "Position X cannot be negative: it is measured from the envelope's corner"],
    [{ xMm: 601 }, "xMm", "Position X must be within the X travel, 0–600 mm"],
    [{ zMm: 650 }, "zMm", "Position Z must be within the Z travel, 0–600 mm"],
    [{ measuredAt: "2999-01-01" }, "measuredAt", "The measurement date cannot be in the future"],
    [{ direction: "w" }, "direction", undefined],
  ])("refuses the impossible reading %j with a message on %s, and stores nothing", async (over, field, message) => {
    const { machine } = await machineWithRecipe();
    const base = `${shopPath()}/machines/${machine.id}/stiffness-readings`;
    const res = await team.owner.agent.post(base).send(reading(over));
    expect(res.status).toBe(400);
    const fields = apiErrorSchema.parse(res.body).error.fields ?? {};
    expect(Object.keys(fields)).toEqual([field]);
    if (message) expect(fields[field]).toBe(message);
    expect(stiffnessReadingListSchema.parse((await team.owner.agent.get(base)).body).items).toEqual([]);
    const after = machineSchema.parse((await team.owner.agent.get(`${shopPath()}/machines/${machine.id}`)).body);
    expect(after.axes).toEqual(machine.axes);
  });

  it("returns a stiffness map over the envelope: compliance interpolated, softer at mid-span, readings included", async () => {
    const { machine } = await machineWithRecipe();
    const base = `${shopPath()}/machines/${machine.id}/stiffness-readings`;
    // Y readings along X: 400 N/mm at the ends, 160 N/mm at mid-span (ILLUSTRATIVE beam).
    for (const [x, d] of [
      [0, 0.125],
      [300, 0.3125],
      [600, 0.125],
    ] as const) {
      expect((await team.owner.agent.post(base).send(reading({ xMm: x, yMm: 0, forceN: 50, deflectionMm: d }))).status).toBe(201);
    }
    const map = stiffnessMapSchema.parse((await team.programmer.agent.get(`${shopPath()}/machines/${machine.id}/stiffness-map`).query({ cells: 5 })).body);
    expect(map.envelope).toEqual({ xMm: 600, yMm: 600, zMm: 600 });
    expect(map.xMm).toEqual([0, 150, 300, 450, 600]);
    expect(map.basis).toBe("worst_case");
    expect(map.readings).toHaveLength(3);
    const y = map.directions.find((d) => d.direction === "y")!;
    expect(y.method).toBe("linear");
    // At x = 150 mm: compliance halfway between 1/400 and 1/160 → 1/((1/400 + 1/160)/2) = 228.57 N/mm (hand calculation).
    expect(y.stiffnessNPerMm![0]![1]).toBeCloseTo(1 / ((1 / 400 + 1 / 160) / 2), 6);
    expect(y.minNPerMm).toBeCloseTo(160, 6);
    expect(y.softestAt).toEqual({ xMm: 300, yMm: 0 });
    expect(y.machineNPerMm).toBeCloseTo(160, 6);
    const x = map.directions.find((d) => d.direction === "x")!;
    expect(x).toMatchObject({ pointCount: 0, stiffnessNPerMm: null, machineNPerMm: 400 });

    const bad = await team.owner.agent.get(`${shopPath()}/machines/${machine.id}/stiffness-map`).query({ cells: 1 });
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toEqual({ "query.cells": "At least 2 cells" });
  });
});

describe("re-check flag", () => {
  it("flags the machine's recipes when a reading moves its stiffness by more than 15 %, not at 15 % or less", async () => {
    // machineBody X stiffness: 400 N/mm.
    const { machine, recipeId } = await machineWithRecipe();
    const base = `${shopPath()}/machines/${machine.id}/stiffness-readings`;
    // 60 N / 0.1739 mm = 345.0 N/mm: −13.7 % → not material.
    const small = stiffnessReadingMutationSchema.parse((await team.owner.agent.post(base).send(reading({ direction: "x", forceN: 60, deflectionMm: 0.1739 }))).body);
    expect(small.changes[0]!.changePct).toBeCloseTo(((400 - 60 / 0.1739) / 400) * 100, 6);
    expect(small.changes[0]!.material).toBe(false);
    expect(small.recipesFlagged).toBe(0);
    expect(await needsRecheck(recipeId)).toBe(false);
    // Then 60 N / 0.2 mm = 300 N/mm: from 345.0 → −13.0 % … still not; then 60 N / 0.24 mm = 250 N/mm: −16.7 % from 300.
    const second = stiffnessReadingMutationSchema.parse((await team.owner.agent.post(base).send(reading({ direction: "x", xMm: 10, forceN: 60, deflectionMm: 0.2 }))).body);
    expect(second.changes[0]!.material).toBe(false);
    expect(await needsRecheck(recipeId)).toBe(false);
    const big = stiffnessReadingMutationSchema.parse((await team.owner.agent.post(base).send(reading({ direction: "x", xMm: 20, forceN: 60, deflectionMm: 0.24 }))).body);
    expect(big.changes[0]!.changePct).toBeCloseTo((50 / 300) * 100, 6);
    expect(big.changes[0]!.material).toBe(true);
    expect(big.recipesFlagged).toBe(1);
    expect(await needsRecheck(recipeId)).toBe(true);
  });

  it("flags on a new mode and on a mode moved by more than 15 %, not on a 10 % change", async () => {
    // machineBody has one Y mode: 25 Hz, ζ 0.03, 250 N/mm.
    const { machine, recipeId } = await machineWithRecipe();
    const modes = `${shopPath()}/machines/${machine.id}/modes`;
    const existing = machineModeListSchema.parse((await team.owner.agent.get(modes)).body).items[0]!;
    expect(existing).toMatchObject({ direction: "y", frequencyHz: 25, source: "manual" });

    const tenPct = modeMutationSchema.parse((await team.owner.agent.patch(`${modes}/${existing.id}`).send({ frequencyHz: 27.5, stiffnessNPerMm: 225 })).body);
    expect(tenPct.changes.map((c) => [c.what, c.changePct, c.material])).toEqual([
      ["mode_frequency", expect.closeTo(10, 9), false],
      ["mode_stiffness", expect.closeTo(10, 9), false],
    ]);
    expect(tenPct.recipesFlagged).toBe(0);
    expect(await needsRecheck(recipeId)).toBe(false);

    const moved = modeMutationSchema.parse((await team.owner.agent.patch(`${modes}/${existing.id}`).send({ stiffnessNPerMm: 180 })).body);
    expect(moved.changes[1]).toMatchObject({ what: "mode_stiffness", before: 225, after: 180, material: true });
    expect(moved.recipesFlagged).toBe(1);
    expect(await needsRecheck(recipeId)).toBe(true);

    await clearRecheck(recipeId);
    const added = modeMutationSchema.parse(
      (await team.tooling_manager.agent.post(modes).send({ source: "measured", direction: "x", frequencyHz: 640, dampingRatio: 0.03, stiffnessNPerMm: 1800, measuredAt: "2026-02-01" })).body,
    );
    expect(added.changes).toEqual([{ what: "mode_added", direction: "x", before: null, after: 640, changePct: null, unit: "Hz", material: true }]);
    expect(added.mode.measuredAt).toBe("2026-02-01T12:00:00.000Z");
    expect(await needsRecheck(recipeId)).toBe(true);

    await clearRecheck(recipeId);
    // A second X mode 5 % above the first: compared with the nearest, not material.
    const near = modeMutationSchema.parse(
      (await team.owner.agent.post(modes).send({ source: "measured", direction: "x", frequencyHz: 672, dampingRatio: 0.03, stiffnessNPerMm: 1850 })).body,
    );
    expect(near.changes[0]).toMatchObject({ what: "mode_frequency", before: 640, after: 672, material: false });
    expect(await needsRecheck(recipeId)).toBe(false);

    const removed = modeMutationSchema.parse((await team.owner.agent.delete(`${modes}/${near.mode.id}`)).body);
    expect(removed.changes[0]).toMatchObject({ what: "mode_removed", material: true });
    expect(removed.recipesFlagged).toBe(1);
    expect(await needsRecheck(recipeId)).toBe(true);
  });
});

describe("modes", () => {
  it("estimates a mode from mass and stiffness with fn = √(k/m)/2π (domain-reference BELT-3: 240 N/mm, 10 kg → 24.656 Hz)", async () => {
    const { machine } = await machineWithRecipe();
    const modes = `${shopPath()}/machines/${machine.id}/modes`;
    const res = await team.owner.agent.post(modes).send({ source: "estimated", direction: "x", massKg: 10, stiffnessNPerMm: 240 });
    expect(res.status).toBe(201);
    const { mode } = modeMutationSchema.parse(res.body);
    expect(mode.frequencyHz).toBeCloseTo(24.656, 3);
    expect(mode).toMatchObject({ source: "estimated", massKg: 10, stiffnessNPerMm: 240, dampingRatio: 0.05 });

    // Without a stiffness: the machine's Z stiffness, 800 N/mm (machineBody), 5 kg → √(800 000/5)/2π = 63.662 Hz (hand calculation).
    const z = modeMutationSchema.parse((await team.owner.agent.post(modes).send({ source: "estimated", direction: "z", massKg: 5 })).body).mode;
    expect(z.frequencyHz).toBeCloseTo(Math.sqrt(800000 / 5) / (2 * Math.PI), 6);
    expect(z.note).toMatch(/machine's Z stiffness/);

    // The machine record shows the same modes.
    const after = machineSchema.parse((await team.operator.agent.get(`${shopPath()}/machines/${machine.id}`)).body);
    expect(after.modes.map((m) => m.frequencyHz).sort((a, b) => a - b)).toEqual([24.656, 25, z.frequencyHz].map((f, i) => (i === 0 ? mode.frequencyHz : f)).sort((a, b) => a - b));
  });

  it("refuses a bad mode with field messages", async () => {
    const { machine } = await machineWithRecipe();
    const modes = `${shopPath()}/machines/${machine.id}/modes`;
    const res = await team.owner.agent.post(modes).send({ source: "manual", direction: "x", frequencyHz: 0, dampingRatio: 1.2, stiffnessNPerMm: -3 });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({
      frequencyHz: "frequency must be more than 0 Hz",
      dampingRatio: "Damping ratio must be below 1",
      stiffnessNPerMm: "modal stiffness must be more than 0 N/mm",
    });
    expect((await team.owner.agent.patch(`${modes}/${randomUUID()}`).send({ note: "x" })).status).toBe(404);
  });
});

describe("backlash readings and ceilings", () => {
  it("sets the axis backlash to the latest reversal-test reading", async () => {
    const { machine, recipeId } = await machineWithRecipe();
    const base = `${shopPath()}/machines/${machine.id}/backlash-readings`;
    const older = backlashReadingMutationSchema.parse((await team.owner.agent.post(base).send({ axis: "x", backlashMm: 0.08, measuredAt: "2026-01-10" })).body);
    expect(older.machineBacklashMm.x).toBe(0.08);
    // 0.02 → 0.08 mm is +300 %: material.
    expect(older.recipesFlagged).toBe(1);
    await clearRecheck(recipeId);
    // An older measurement entered later does not replace the latest one.
    const stale = backlashReadingMutationSchema.parse((await team.owner.agent.post(base).send({ axis: "x", backlashMm: 0.2, measuredAt: "2025-06-01" })).body);
    expect(stale.machineBacklashMm.x).toBe(0.08);
    expect(stale.recipesFlagged).toBe(0);
    expect(backlashReadingListSchema.parse((await team.operator.agent.get(base)).body).items.map((r) => r.backlashMm)).toEqual([0.08, 0.2]);
    const neg = await team.owner.agent.post(base).send({ axis: "x", backlashMm: -0.01, measuredAt: "2026-01-10" });
    expect(apiErrorSchema.parse(neg.body).error.fields).toEqual({ backlashMm: "Backlash cannot be negative" });
  });

  it("reads and replaces the ceilings; a change flags recipes, the same values do not", async () => {
    const { machine, recipeId } = await machineWithRecipe();
    const base = `${shopPath()}/machines/${machine.id}/ceilings`;
    expect(ceilingsSchema.parse((await team.operator.agent.get(base)).body)).toEqual({
      machineId: machine.id,
      deflectionCeilingMm: 0.025,
      avoidBands: [],
      modeMarginPct: 10,
    });
    const body = { deflectionCeilingMm: 0.02, avoidBands: [{ minHz: 560, maxHz: 640, note: "Spindle housing ring" }], modeMarginPct: 12 };
    const put = ceilingsMutationSchema.parse((await team.owner.agent.put(base).send(body)).body);
    expect(put).toEqual({ machineId: machine.id, ...body, recipesFlagged: 1 });
    await clearRecheck(recipeId);
    expect(ceilingsMutationSchema.parse((await team.owner.agent.put(base).send(body)).body).recipesFlagged).toBe(0);
    expect(await needsRecheck(recipeId)).toBe(false);
    const bad = await team.owner.agent.put(base).send({ avoidBands: [{ minHz: 700, maxHz: 600 }] });
    expect(apiErrorSchema.parse(bad.body).error.fields).toEqual({ "avoidBands.0.maxHz": "Band end must be above its start" });
  });
});

describe("roles and shops", () => {
  it("lets every member read, and only owners and tooling managers change the profile", async () => {
    const { machine } = await machineWithRecipe();
    const m = `${shopPath()}/machines/${machine.id}`;
    for (const who of [team.programmer, team.operator]) {
      for (const [method, path, body] of [
        ["post", "/stiffness-readings", reading()],
        ["post", "/backlash-readings", { axis: "x", backlashMm: 0.01, measuredAt: "2026-01-01" }],
        ["post", "/modes", { source: "manual", direction: "x", frequencyHz: 100, dampingRatio: 0.05, stiffnessNPerMm: 100 }],
        ["put", "/ceilings", { deflectionCeilingMm: 0.01 }],
      ] as const) {
        const res = await who.agent[method](`${m}${path}`).send(body);
        expect(res.status).toBe(403);
        expect(apiErrorSchema.parse(res.body).error.message).toBe("Only an owner or tooling manager of this shop can do this.");
      }
      for (const path of ["/stiffness-readings", "/backlash-readings", "/modes", "/ceilings", "/stiffness-map", "/recordings"]) {
        expect((await who.agent.get(`${m}${path}`)).status).toBe(200);
      }
    }
  });

  it("answers 404 for a machine of another shop, even to its owner's requests on this shop's path", async () => {
    const other = await teamShop(app, "vib-other");
    const foreign = machineSchema.parse((await other.owner.agent.post(`/api/shops/${other.shopId}/machines`).send(machineBody())).body);
    // The machine exists, but not in this shop: 404 as for a machine that does not exist.
    for (const path of ["/stiffness-readings", "/modes", "/ceilings", "/stiffness-map", "/recordings", "/backlash-readings"]) {
      const res = await team.owner.agent.get(`${shopPath()}/machines/${foreign.id}${path}`);
      expect(res.status).toBe(404);
      expect(apiErrorSchema.parse(res.body).error.message).toBe("Machine not found.");
    }
    expect((await team.owner.agent.post(`${shopPath()}/machines/${foreign.id}/stiffness-readings`).send(reading())).status).toBe(404);
    expect((await team.owner.agent.get(`${shopPath()}/machines/not-a-uuid/modes`)).status).toBe(404);
  });
});
