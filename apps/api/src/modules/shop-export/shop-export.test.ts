import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { apiErrorSchema, recipeSchema, shopExportSchema, type Recipe } from "@ringdown/contracts";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { libraryFor } from "../recipes/recipe-test-fixtures.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

type Role = "owner" | "tooling_manager" | "programmer" | "operator";
let people: Record<Role, SignedUp>;
let outsider: SignedUp;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let recipe: Recipe;
let risky: Recipe;
let shopId: string;
const url = (path: string) => `/api/shops/${shopId}${path}`;

/** Reads a CSV response body (UTF-8 with a byte-order mark) into records by header. */
function rowsOf(text: string): Array<Record<string, string>> {
  expect(text.charCodeAt(0)).toBe(0xfeff);
  return parse(text.slice(1), { columns: true }) as Array<Record<string, string>>;
}

beforeAll(async () => {
  const owner = await createPerson(app, "ex-owner", "Export shop");
  shopId = owner.shopId;
  const [tm, prog, op] = await Promise.all([createPerson(app, "ex-tm"), createPerson(app, "ex-prog"), createPerson(app, "ex-op")]);
  await Promise.all([joinShop(tm.userId, shopId, "tooling_manager"), joinShop(prog.userId, shopId, "programmer"), joinShop(op.userId, shopId, "operator")]);
  people = { owner, tooling_manager: tm, programmer: prog, operator: op };
  outsider = await createPerson(app, "ex-outsider", "Not exported");
  lib = await libraryFor(shopId);
  await libraryFor(outsider.shopId);
  const create = async (name: string) =>
    recipeSchema.parse(
      (
        await prog.agent
          .post(url("/recipes"))
          .send({ name, assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 2, radialDepthMm: 1 } })
          .expect(201)
      ).body,
    );
  recipe = await create("Fixture plate pocket");
  risky = await create("=HYPERLINK(\"x\")");
  await prog.agent.patch(url(`/recipes/${recipe.id}`)).send({ notes: "Vacuum table, zone 2", changeNote: "Workholding" }).expect(200);
  await prog.agent.post(url(`/recipes/${recipe.id}/transition`)).send({ to: "trial" }).expect(200);
  await op.agent.post(url(`/recipes/${recipe.id}/cut-logs`)).send({ outcome: "poor_finish", actualRpm: 18000, actualFeedMmPerMin: 1200, axialDepthMm: 2, radialDepthMm: 1, note: "Fuzzy top edge" }).expect(201);
});

describe("GET export?format=json", () => {
  it("returns everything the shop owns, recipes with their history, and nothing of other shops", async () => {
    const res = await people.tooling_manager.agent.get(url("/export?format=json"));
    expect(res.status).toBe(200);
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename="ringdown-export-shop-\d{4}-\d{2}-\d{2}\.json"$/);
    const out = shopExportSchema.parse(res.body);
    expect(out.shop).toEqual({ id: shopId, name: "Export shop" });
    expect(out.cutters.map((c) => c.id)).toEqual([lib.cutterId]);
    expect(out.machines.map((m) => m.name).sort()).toEqual(["Test bench mill", "Test gantry router"]);
    expect(out.machines.find((m) => m.id === lib.routerId)?.modes).toHaveLength(2);
    expect(out.assemblies.map((a) => a.id).sort()).toEqual([lib.routerAssemblyId, lib.millAssemblyId].sort());
    expect(out.materials.map((m) => m.id).sort()).toEqual([lib.aluminiumId, lib.mdfId].sort());

    const exported = out.recipes.find((r) => r.id === recipe.id)!;
    expect(exported).toMatchObject({ name: "Fixture plate pocket", status: "trial", revision: 2, notes: "Vacuum table, zone 2" });
    expect(exported.revisions.map((v) => [v.revision, v.changeNote])).toEqual([
      [2, "Workholding"],
      [1, "Created"],
    ]);
    expect(exported.transitions.map((t) => [t.from, t.to])).toEqual([["draft", "trial"]]);
    expect(out.cutLogs).toHaveLength(1);
    expect(out.cutLogs[0]).toMatchObject({ recipeId: recipe.id, outcome: "poor_finish", note: "Fuzzy top edge" });
    expect(out.recipes).toHaveLength(2);
  });

  it("is for owners and tooling managers only", async () => {
    expect((await people.owner.agent.get(url("/export"))).status).toBe(200);
    for (const who of ["programmer", "operator"] as const) {
      const res = await people[who].agent.get(url("/export?format=json"));
      expect(res.status).toBe(403);
      expect(apiErrorSchema.parse(res.body).error.code).toBe("forbidden");
    }
    const bad = await people.owner.agent.get(url("/export?format=xml"));
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {})).toEqual(["query.format"]);
  });
});

describe("GET export/<entity>.csv", () => {
  it("writes recipes with their numbers, defusing spreadsheet formulas", async () => {
    const res = await people.owner.agent.get(url("/export/recipes.csv")).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("text/csv; charset=utf-8");
    const rows = rowsOf(res.text);
    expect(rows).toHaveLength(2);
    const row = rows.find((r) => r.id === recipe.id)!;
    expect(row).toMatchObject({ name: "Fixture plate pocket", status: "trial", revision: "2", machine: "Test gantry router", cutter: "Test 6 mm 2F flat", holder: "ER20 collet", material: "Test aluminium 6061", operation: "profile", axial_depth_mm: "2", cut_logs: "1" });
    expect(Number(row.rpm)).toBeGreaterThan(0);
    // A cell a spreadsheet would run as a formula is written with a leading apostrophe.
    expect(rows.find((r) => r.id === risky.id)!.name).toBe("'=HYPERLINK(\"x\")");
  });

  it("writes cut logs, assemblies and cutters", async () => {
    const logs = rowsOf((await people.owner.agent.get(url("/export/cut-logs.csv")).buffer(true)).text);
    expect(logs).toHaveLength(1);
    expect(logs[0]).toMatchObject({ recipe: "Fixture plate pocket", machine: "Test gantry router", material: "Test aluminium 6061", outcome: "poor_finish", actual_rpm: "18000", note: "Fuzzy top edge", logged_by: "Test ex-op", photos: "0" });
    const assemblies = rowsOf((await people.owner.agent.get(url("/export/assemblies.csv")).buffer(true)).text);
    expect(assemblies.map((a) => [a.machine, a.stickout_mm]).sort()).toEqual([
      ["Test bench mill", "20"],
      ["Test gantry router", "24"],
    ]);
    // The cutters file uses the cutter import's own column set, so it imports back as it is.
    const cutters = rowsOf((await people.owner.agent.get(url("/export/cutters.csv")).buffer(true)).text);
    expect(cutters).toEqual([expect.objectContaining({ name: "Test 6 mm 2F flat", shape: "flat", diameter_mm: "6", flutes: "2" })]);
  });

  it("answers 404 for an unknown file and 403 below tooling manager", async () => {
    expect((await people.owner.agent.get(url("/export/passwords.csv"))).status).toBe(404);
    expect((await people.owner.agent.get(url("/export/recipes.xlsx"))).status).toBe(404);
    expect((await people.programmer.agent.get(url("/export/recipes.csv"))).status).toBe(403);
  });
});
