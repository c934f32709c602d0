import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { apiErrorSchema, auditEventPageSchema, recipeSchema, shopExportSchema, type Recipe } from "@ringdown/contracts";
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
  const create = async (name: string, params: Record<string, unknown> = {}) =>
    recipeSchema.parse(
      (
        await prog.agent
          .post(url("/recipes"))
          .send({ name, assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 2, radialDepthMm: 1, ...params } })
          .expect(201)
      ).body,
    );
  recipe = await create("Fixture plate pocket");
  // Every length the recipe file can hold, so the unit checks below see no blank cells.
  risky = await create("=HYPERLINK(\"x\")", {
    axialDepthMm: 1.5,
    radialDepthMm: 0.8,
    workPositionXMm: 120,
    workPositionYMm: 40,
    workRegion: { xMinMm: 100, xMaxMm: 300, yMinMm: 20, yMaxMm: 60 },
    rpmOverride: 16000,
    chipLoadOverrideMm: 0.04,
  });
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

  it("records in the change history who downloaded which file, and in which units", async () => {
    await people.tooling_manager.agent.get(url("/export/cut-logs.csv?units=imperial")).buffer(true).expect(200);
    await people.tooling_manager.agent.get(url("/export?format=json")).expect(200);
    const events = auditEventPageSchema.parse(
      (await people.owner.agent.get(url("/audit-events")).query({ action: "shop.exported", pageSize: 2 }).expect(200)).body,
    ).items;
    // Newest first: the JSON (always SI, so no units), then the imperial cut log.
    expect(events.map((e) => [e.actorId, e.detail])).toEqual([
      [people.tooling_manager.userId, { file: "json" }],
      [people.tooling_manager.userId, { file: "cut-logs", units: "imperial" }],
    ]);
  });
});

/**
 * The imperial column of each metric unit suffix, mm per imperial unit, and the decimal places the
 * export writes. Exact by definition: 1 in = 25.4 mm (NIST SP 811, appendix B; the international
 * yard and pound agreement of 1959), so 1 in³ = 25.4³ mm³ = 16 387.064 mm³. Longest suffix first.
 */
const imperialOf: Array<{ metric: string; imperial: string; mmPerUnit: number; decimals: number }> = [
  { metric: "_mm3_per_min", imperial: "_in3_per_min", mmPerUnit: 25.4 ** 3, decimals: 4 },
  { metric: "_mm_per_min", imperial: "_in_per_min", mmPerUnit: 25.4, decimals: 4 },
  { metric: "_mm", imperial: "_in", mmPerUnit: 25.4, decimals: 6 },
];
const conversionOf = (header: string) => imperialOf.find((c) => header.endsWith(c.metric));

/** Header row of a CSV body (after its byte-order mark). */
const headerOf = (text: string): string[] => (parse(text.slice(1), { to_line: 1 }) as string[][])[0]!;

describe("GET export/<entity>.csv?units=imperial", () => {
  const files = [
    { file: "recipes.csv", key: "id" },
    { file: "cut-logs.csv", key: "id" },
    { file: "assemblies.csv", key: "id" },
    { file: "cutters.csv", key: "name" },
  ] as const;

  for (const { file, key } of files) {
    it(`${file}: every metric column has its inch twin, holding the metric value converted`, async () => {
      const metric = await people.owner.agent.get(url(`/export/${file}`)).buffer(true);
      const imperial = await people.owner.agent.get(url(`/export/${file}?units=imperial`)).buffer(true);
      expect(metric.status).toBe(200);
      expect(imperial.status).toBe(200);
      expect(imperial.headers["content-disposition"]).toMatch(/-inch\.csv"$/);
      expect((await people.owner.agent.get(url(`/export/${file}?units=metric`)).buffer(true)).text).toBe(metric.text);

      const metricHeader = headerOf(metric.text);
      expect(metricHeader.some((h) => conversionOf(h))).toBe(true);
      expect(headerOf(imperial.text)).toEqual(
        metricHeader.map((h) => {
          const c = conversionOf(h);
          return c ? h.slice(0, -c.metric.length) + c.imperial : h;
        }),
      );
      expect(headerOf(imperial.text).filter((h) => /_mm(3)?(_|$)/.test(h))).toEqual([]);

      const metricRows = rowsOf(metric.text);
      const imperialRows = new Map(rowsOf(imperial.text).map((r) => [r[key], r]));
      expect(metricRows.length).toBeGreaterThan(0);
      expect(imperialRows.size).toBe(metricRows.length);
      let converted = 0;
      for (const m of metricRows) {
        const i = imperialRows.get(m[key]!)!;
        expect(i).toBeDefined();
        for (const [header, cell] of Object.entries(m)) {
          const c = conversionOf(header);
          if (!c) {
            // rpm, W, %, counts and text are the same in both files.
            expect(i[header], header).toBe(cell);
            continue;
          }
          const inches = i[header.slice(0, -c.metric.length) + c.imperial]!;
          if (cell === "") {
            expect(inches, header).toBe("");
            continue;
          }
          // Written to `decimals` places: within half of the last place (plus the metric file's own rounding to 10 digits).
          expect(Math.abs(Number(inches) - Number(cell) / c.mmPerUnit), `${header} ${cell} → ${inches}`).toBeLessThanOrEqual(0.5 * 10 ** -c.decimals + 1e-9);
          if (Number(cell) !== 0) converted += 1;
        }
      }
      expect(converted).toBeGreaterThan(0);
    });
  }

  it("writes the figures a person would work out by hand", async () => {
    // 1200 mm/min ÷ 25.4 = 47.244094… in/min; 24 mm ÷ 25.4 = 0.944881889… in; 20 mm ÷ 25.4 = 0.787401574… in.
    const logs = rowsOf((await people.owner.agent.get(url("/export/cut-logs.csv?units=imperial")).buffer(true)).text);
    expect(logs[0]).toMatchObject({ actual_rpm: "18000", actual_feed_in_per_min: "47.2441", axial_depth_in: "0.07874", radial_depth_in: "0.03937" });
    const assemblies = rowsOf((await people.owner.agent.get(url("/export/assemblies.csv?units=imperial")).buffer(true)).text);
    expect(assemblies.map((a) => [a.machine, a.stickout_in]).sort()).toEqual([
      ["Test bench mill", "0.787402"],
      ["Test gantry router", "0.944882"],
    ]);
    const recipes = rowsOf((await people.owner.agent.get(url("/export/recipes.csv?units=imperial")).buffer(true)).text);
    // 300 mm ÷ 25.4 = 11.811023… in; 0.04 mm ÷ 25.4 = 0.0015748… in per tooth; spindle speed and power keep their units.
    expect(recipes.find((r) => r.id === risky.id)).toMatchObject({ work_region_x_to_in: "11.811024", chosen_chip_load_in: "0.001575", chosen_rpm: "16000" });
    expect(Object.keys(recipes[0]!)).toContain("power_w");
  });

  it("refuses a unit system it does not know, naming the field", async () => {
    const res = await people.owner.agent.get(url("/export/recipes.csv?units=furlongs"));
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {})).toEqual(["query.units"]);
  });
});
