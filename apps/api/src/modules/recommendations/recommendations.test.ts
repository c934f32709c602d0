import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, planRecipe, recipeParamsSchema, recommendationResponseSchema, summarizeRecommendation, type MachineBody } from "@ringdown/contracts";
import { SAFETY_NOTES } from "@ringdown/machining";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { insertAssembly, insertCutter, insertMachine, libraryFor, routerMachine } from "../recipes/recipe-test-fixtures.js";
import { findAssemblyRecords, findUsableMaterial } from "./planning.repository.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let owner: SignedUp;
let operator: SignedUp;
let outsider: SignedUp;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let quietAssemblyId: string;
const url = () => `/api/shops/${owner.shopId}/recommendations`;

beforeAll(async () => {
  owner = await createPerson(app, "rec-owner", "Recommendation shop");
  operator = await createPerson(app, "rec-op");
  await joinShop(operator.userId, owner.shopId, "operator");
  outsider = await createPerson(app, "rec-outsider", "Elsewhere");
  lib = await libraryFor(owner.shopId);
  // A stiff machine without modes or bands: nothing moves the speed off the material's target.
  const quiet: MachineBody = {
    ...routerMachine,
    name: "Quiet stiff router",
    axes: {
      x: { ...routerMachine.axes.x, stiffnessNPerMm: 50000 },
      y: { ...routerMachine.axes.y, stiffnessNPerMm: 50000 },
      z: { ...routerMachine.axes.z, stiffnessNPerMm: 50000 },
    },
    modes: [],
    deflectionCeilingMm: 0.05,
  };
  const quietMachine = await insertMachine(owner.shopId, quiet);
  const cutter = await insertCutter(owner.shopId, { name: "Stubby 6 mm", fluteLengthMm: 12 });
  quietAssemblyId = await insertAssembly(owner.shopId, quietMachine, cutter, 15, 0);
});

describe("POST recommendations", () => {
  it("runs the engine on the shop's records and returns the full result with the cautions", async () => {
    const body = { assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1.5 } };
    const res = await operator.agent.post(url()).send(body);
    expect(res.status).toBe(200);
    const out = recommendationResponseSchema.parse(res.body);
    const records = (await findAssemblyRecords(owner.shopId, lib.routerAssemblyId))!;
    const material = (await findUsableMaterial(owner.shopId, lib.aluminiumId))!;
    const expected = planRecipe({ ...records, material, operation: "profile", params: recipeParamsSchema.parse(body.params) });
    expect(out.recommendation).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(out.summary).toEqual(summarizeRecommendation(expected));
    expect(out.safetyNotes).toEqual([...SAFETY_NOTES]);
    expect(out.context).toEqual({
      machineId: lib.routerId,
      machineName: "Test gantry router",
      cutterId: lib.cutterId,
      cutterName: "Test 6 mm 2F flat",
      materialName: "Test aluminium 6061",
    });
    expect(Object.keys(out.recommendation.explain)).toEqual(expect.arrayContaining(["rpm", "feedMmPerMin", "totalDeflectionMm"]));
  });

  it("matches the handbook speed and feed formulas where no ceiling binds", async () => {
    const res = await owner.agent
      .post(url())
      .send({ assemblyId: quietAssemblyId, materialId: lib.aluminiumId, operation: "slot", params: { axialDepthMm: 0.5, radialDepthMm: 6 } });
    const rec = recommendationResponseSchema.parse(res.body).recommendation;
    // Machinery's Handbook cutting-speed formula (domain-reference SPD-1/2): n = 1000·vc/(π·D); the
    // engine targets the middle of the material's carbide range, (250 + 600)/2 = 425 m/min, at D = 6 mm:
    // n = 425000 / (π · 6) = 22 546.5 rpm (hand calculation).
    expect(rec.rpm).toBeCloseTo(425000 / (Math.PI * 6), 3);
    // Table feed vf = fz·z·n (domain-reference FEED-1); slotting, so no chip thinning: fz = 0.04 mm
    // (the middle of the test row's 0.03–0.05 mm at 6 mm): vf = 0.04 · 2 · 22 546.5 = 1803.7 mm/min.
    expect(rec.compensatedChipLoadMm).toBeCloseTo(0.04, 12);
    expect(rec.feedMmPerMin).toBeCloseTo(0.04 * 2 * (425000 / (Math.PI * 6)), 3);
    expect(rec.limits.every((l) => l.holds)).toBe(true);
  });

  it("answers 400 with the request's field names when the engine refuses the input", async () => {
    const res = await owner.agent
      .post(url())
      .send({ assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 30, radialDepthMm: 8 } });
    expect(res.status).toBe(400);
    const fields = apiErrorSchema.parse(res.body).error.fields ?? {};
    expect(fields["params.axialDepthMm"]).toBe("Axial depth is deeper than the flute length (18 mm)");
    expect(fields["params.radialDepthMm"]).toBe("Radial depth cannot exceed the cutter diameter (6 mm)");
  });

  it("answers 400 for a bad body and for records that are missing or another shop's", async () => {
    const bad = await owner.agent.post(url()).send({ assemblyId: "x", operation: "mill", params: {} });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {})).toEqual(
      expect.arrayContaining(["assemblyId", "materialId", "operation", "params.axialDepthMm", "params.radialDepthMm"]),
    );
    const theirs = await libraryFor(outsider.shopId);
    const foreign = await owner.agent
      .post(url())
      .send({ assemblyId: theirs.routerAssemblyId, materialId: randomUUID(), operation: "profile", params: { axialDepthMm: 1, radialDepthMm: 1 } });
    expect(foreign.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(foreign.body).error.fields ?? {}).sort()).toEqual(["assemblyId", "materialId"]);
  });
});
