import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  cutLogPageSchema,
  ladderSchema,
  planRecipe,
  recipeRevisionListSchema,
  recipeSchema,
  type Ladder,
  type Recipe,
} from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { findAssemblyRecords, findUsableMaterial } from "../recommendations/planning.repository.js";
import { libraryFor } from "../recipes/recipe-test-fixtures.js";
import { geometricSteps } from "./ladder-plan.js";
import { outcomeFromScore } from "./ladders.service.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

type Role = "owner" | "programmer" | "operator";
let people: Record<Role, SignedUp>;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let shopId: string;
const url = (path = "") => `/api/shops/${shopId}/recipes${path}`;

beforeAll(async () => {
  const owner = await createPerson(app, "lad-owner", "Ladder shop");
  shopId = owner.shopId;
  const [prog, op] = await Promise.all([createPerson(app, "lad-prog"), createPerson(app, "lad-op")]);
  await Promise.all([joinShop(prog.userId, shopId, "programmer"), joinShop(op.userId, shopId, "operator")]);
  people = { owner, programmer: prog, operator: op };
  lib = await libraryFor(shopId);
});

async function recipe(status = "trial", assemblyId = lib.routerAssemblyId): Promise<Recipe> {
  const res = await people.programmer.agent
    .post(url())
    .send({ name: "Ladder me", assemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1.5 } });
  const r = recipeSchema.parse(res.body);
  if (status !== "draft") await getSequelize().query(`UPDATE recipes SET status = :status WHERE id = :id`, { replacements: { id: r.id, status } });
  return r;
}

async function build(id: string, parameter: "rpm" | "feed" | "depth", rungs = 5): Promise<Ladder> {
  const res = await people.programmer.agent.post(url(`/${id}/ladder`)).send({ parameter, rungs });
  if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
  return ladderSchema.parse(res.body);
}

/** Re-runs the engine on each rung's own parameters: every ceiling must hold and the numbers must match. */
async function expectEveryRungSafe(r: Recipe, ladder: Ladder): Promise<void> {
  const records = (await findAssemblyRecords(shopId, r.assemblyId))!;
  const material = (await findUsableMaterial(shopId, r.materialId))!;
  for (const rung of ladder.rungs) {
    const rec = planRecipe({ ...records, material, operation: r.operation, params: rung.recipeParams! });
    expect(rec.ok).toBe(true);
    for (const limit of rec.limits) expect(limit.holds, `${limit.label}: ${limit.detail}`).toBe(true);
    expect(rec.rpm).toBeCloseTo(rung.params.rpm, 6);
    expect(rec.feedMmPerMin).toBeCloseTo(rung.params.feedMmPerMin, 6);
    expect(rec.axialDepthMm).toBeCloseTo(rung.params.axialDepthMm, 9);
    expect(rung.params.rpm).toBeLessThanOrEqual(records.machine.spindle.maxRpm);
    expect(rung.params.rpm).toBeGreaterThanOrEqual(records.machine.spindle.minRpm);
    expect(rung.params.rpm).toBeLessThanOrEqual(records.cutter.maxRpm!);
    expect(rung.params.feedMmPerMin).toBeLessThanOrEqual(Math.min(records.machine.axes.x.maxFeedMmPerMin, records.machine.axes.y.maxFeedMmPerMin));
    expect(rung.result!.totalDeflectionMm).toBeLessThanOrEqual(records.machine.deflectionCeilingMm * (1 + 1e-9));
  }
}

describe("geometricSteps", () => {
  it("spaces rungs by equal ratios", () => {
    // 1000, 2000, 4000, 8000: ratio 2 between neighbours (worked by hand).
    expect(geometricSteps(1000, 8000, 4).map((v) => Math.round(v * 1e6) / 1e6)).toEqual([1000, 2000, 4000, 8000]);
    expect(geometricSteps(5, 5, 3)).toEqual([5]);
  });
});

describe("POST recipes/:id/ladder", () => {
  it.each(["rpm", "feed", "depth"] as const)("steps %s through the safe window, every rung re-checked by the engine", async (parameter) => {
    const r = await recipe();
    const ladder = await build(r.id, parameter);
    expect(ladder).toMatchObject({ recipeId: r.id, parameter, chosenRung: null, baseRevision: 1, createdByName: "Test lad-prog" });
    // Five rungs fit the feed and depth windows; speeds above 21 060 rpm fall within 10 % of the
    // 780 Hz mode (2 flutes: 60 · 702 / 2) and the chatter boundary moves others onto stable speeds,
    // so the speed ladder holds fewer, distinct rungs and says so.
    if (parameter === "rpm") {
      expect(ladder.rungs.length, ladder.note).toBeGreaterThanOrEqual(3);
      expect(ladder.rungs.every((g) => g.params.rpm <= 21060 * (1 + 1e-6))).toBe(true);
    } else expect(ladder.rungs.length, ladder.note).toBe(5);
    expect(ladder.rungs.map((g) => g.index)).toEqual(ladder.rungs.map((_, i) => i));
    expect(ladder.rungs.every((g) => g.score === null && g.cutLogId === null)).toBe(true);
    await expectEveryRungSafe(r, ladder);

    const stepped = ladder.rungs.map((g) => (parameter === "rpm" ? g.params.rpm : parameter === "feed" ? g.params.feedMmPerMin : g.params.axialDepthMm));
    // Strictly rising from rung to rung, and the window names the ends.
    for (let i = 1; i < stepped.length; i++) expect(stepped[i]!).toBeGreaterThan(stepped[i - 1]!);
    expect(ladder.window).toMatchObject({ min: Math.min(...stepped), max: Math.max(...stepped), unit: { rpm: "rpm", feed: "mm/min", depth: "mm" }[parameter] });
    expect(ladder.note).toBeTruthy();
    // Only the stepped parameter moves: the others stay as the engine runs the recipe now.
    const held = { rpm: r.result.rpm, feed: r.result.chipLoadMm, depth: undefined };
    if (parameter !== "rpm") expect(ladder.rungs.every((g) => Math.abs(g.params.rpm - held.rpm) < 1e-6)).toBe(true);
    if (parameter === "rpm") expect(ladder.rungs.every((g) => Math.abs(g.chipLoadMm! - held.feed) < 1e-9)).toBe(true);
    if (parameter !== "depth") expect(new Set(ladder.rungs.map((g) => g.params.axialDepthMm.toFixed(9))).size).toBe(1);
    if (parameter === "depth") {
      // Half the depth the recipe runs at, at the bottom; at most twice it at the top, never deeper than the flutes.
      const depth = r.result.axialDepthMm!;
      expect(ladder.rungs[0]!.params.axialDepthMm).toBeCloseTo(depth / 2, 9);
      expect(ladder.rungs.at(-1)!.params.axialDepthMm).toBeLessThanOrEqual(Math.min(2 * depth, 18) * (1 + 1e-9));
    }

    // GET returns the newest ladder.
    expect(ladderSchema.parse((await people.owner.agent.get(url(`/${r.id}/ladder`)).expect(200)).body)).toEqual(ladder);
  });

  it("validates the body and the role", async () => {
    const r = await recipe();
    const bad = await people.programmer.agent.post(url(`/${r.id}/ladder`)).send({ parameter: "colour", rungs: 12 });
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toEqual({ parameter: expect.any(String), rungs: "At most 7 rungs" });
    expect((await people.operator.agent.post(url(`/${r.id}/ladder`)).send({ parameter: "rpm" })).status).toBe(403);
    expect((await people.programmer.agent.get(url(`/${r.id}/ladder`))).status).toBe(404);
  });

  it("refuses a retired recipe", async () => {
    const r = await recipe("retired");
    expect((await people.programmer.agent.post(url(`/${r.id}/ladder`)).send({ parameter: "rpm" })).status).toBe(409);
  });
});

describe("scoring and choosing rungs", () => {
  it("reads an outcome from the scores when none is given", () => {
    expect(outcomeFromScore({ sound: 2, heat: 5, edgeQuality: 1 })).toBe("chatter");
    expect(outcomeFromScore({ sound: 4, heat: 4, edgeQuality: 1 })).toBe("burn_melt");
    expect(outcomeFromScore({ sound: 4, heat: 2, edgeQuality: 2 })).toBe("poor_finish");
    expect(outcomeFromScore({ sound: 4, heat: 2, edgeQuality: 4 })).toBe("clean");
    expect(outcomeFromScore({ sound: 4, heat: 2, edgeQuality: 4, outcome: "other" })).toBe("other");
  });

  it("lets an operator score rungs of a recipe on trial; each score is a cut-log entry", async () => {
    const r = await recipe("trial");
    const ladder = await build(r.id, "feed", 3);
    const score = { index: 1, edgeQuality: 4, chips: "chips", sound: 5, heat: 2, measuredSizeMm: 12.02, note: "Crisp edge" };
    const scored = ladderSchema.parse((await people.operator.agent.post(url(`/${r.id}/ladder/score`)).send(score).expect(200)).body);
    const rung = scored.rungs[1]!;
    expect(rung.score).toMatchObject({ edgeQuality: 4, chips: "chips", sound: 5, heat: 2, measuredSizeMm: 12.02, outcome: "clean", scoredById: people.operator.userId });
    expect(rung.cutLogId).toBeTruthy();
    const logs = cutLogPageSchema.parse((await people.programmer.agent.get(url(`/${r.id}/cut-logs`))).body).items;
    expect(logs).toHaveLength(1);
    expect(logs[0]).toMatchObject({ id: rung.cutLogId, outcome: "clean", actualRpm: ladder.rungs[1]!.params.rpm, actualFeedMmPerMin: ladder.rungs[1]!.params.feedMmPerMin });
    expect(logs[0]!.note).toMatch(/^Test-cut ladder \(feed\), rung 2 of 3: edge 4\/5, chips, sound 5\/5, heat 2\/5, measured 12.02 mm. Crisp edge$/);

    // Scoring the rung again updates that entry instead of adding one.
    await people.operator.agent.post(url(`/${r.id}/ladder/score`)).send({ ...score, sound: 1 }).expect(200);
    const again = cutLogPageSchema.parse((await people.programmer.agent.get(url(`/${r.id}/cut-logs`))).body).items;
    expect(again.map((l) => [l.id, l.outcome])).toEqual([[rung.cutLogId, "chatter"]]);

    const bad = await people.operator.agent.post(url(`/${r.id}/ladder/score`)).send({ ...score, index: 9 });
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toEqual({ index: "Choose a rung from 1 to 3" });
    const invalid = await people.operator.agent.post(url(`/${r.id}/ladder/score`)).send({ index: 0, edgeQuality: 6, chips: "sand", sound: 0, heat: 3 });
    expect(Object.keys(apiErrorSchema.parse(invalid.body).error.fields ?? {}).sort()).toEqual(["chips", "edgeQuality", "sound"]);
  });

  it("hides the ladder of a draft from operators", async () => {
    const r = await recipe("draft");
    await build(r.id, "rpm", 3);
    expect((await people.operator.agent.get(url(`/${r.id}/ladder`))).status).toBe(404);
    expect((await people.operator.agent.post(url(`/${r.id}/ladder/score`)).send({ index: 0, edgeQuality: 3, chips: "mixed", sound: 3, heat: 3 })).status).toBe(404);
  });

  it("makes the chosen rung the recipe's next revision, once; then the ladder's clean cut proves it", async () => {
    const r = await recipe("trial");
    const ladder = await build(r.id, "depth", 4);
    await people.programmer.agent.post(url(`/${r.id}/ladder/score`)).send({ index: 2, edgeQuality: 5, chips: "chips", sound: 5, heat: 1 }).expect(200);
    expect((await people.operator.agent.post(url(`/${r.id}/ladder/choose`)).send({ index: 2 })).status).toBe(403);
    const chosen = ladderSchema.parse((await people.programmer.agent.post(url(`/${r.id}/ladder/choose`)).send({ index: 2, changeNote: "Best edge" }).expect(200)).body);
    expect(chosen.chosenRung).toBe(2);

    const after = recipeSchema.parse((await people.programmer.agent.get(url(`/${r.id}`))).body);
    expect(after.revision).toBe(2);
    expect(after.params).toEqual(ladder.rungs[2]!.recipeParams);
    expect(after.result.rpm).toBeCloseTo(ladder.rungs[2]!.params.rpm, 6);
    expect(after.result.feedMmPerMin).toBeCloseTo(ladder.rungs[2]!.params.feedMmPerMin, 6);
    const rev = recipeRevisionListSchema.parse((await people.programmer.agent.get(url(`/${r.id}/revisions`))).body).items[0]!;
    expect(rev.changeNote).toMatch(/^Test-cut ladder \(axial depth\): rung 3 chosen — \d+ rpm, \d+ mm\/min, [\d.]+ mm deep\. Best edge$/);

    const twice = await people.programmer.agent.post(url(`/${r.id}/ladder/choose`)).send({ index: 1 });
    expect(twice.status).toBe(409);
    expect((await people.programmer.agent.post(url(`/${r.id}/transition`)).send({ to: "proven" })).status).toBe(200);
  });

  it("refuses to choose from a ladder built on an older revision", async () => {
    const r = await recipe("trial");
    await build(r.id, "rpm", 3);
    await people.programmer.agent.patch(url(`/${r.id}`)).send({ params: { axialDepthMm: 2, radialDepthMm: 1.5 } }).expect(200);
    const res = await people.programmer.agent.post(url(`/${r.id}/ladder/choose`)).send({ index: 0 });
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("The recipe changed since this ladder was built (revision 1, now 2). Build a new ladder.");
  });
});
