import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  cutterImportErrorSchema,
  cutterImportReportSchema,
  cutterPageSchema,
  type Cutter,
} from "@ringdown/contracts";
import { disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import { teamShop, type Team } from "../machines/library-test-fixtures.js";
import { MAX_CSV_BYTES } from "./cutters-csv.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

const HEADER =
  "name,shape,tool_material,status,diameter_mm,flutes,flute_length_mm,overall_length_mm,shank_diameter_mm,corner_radius_mm,helix_deg,tip_angle_deg,max_rpm,coating,maker,part_number,notes";
const good1 = "Import 6 mm flat,flat,carbide,approved,6,2,22,60,6,0,30,,24000,,house stock,IM-6,";
const good3 = 'Import 60° vee,vee,carbide,,12.7,2,11,50.8,6.35,,,60,,,,"VB-60","Engraving, labels"';
const bad2 = "Import broken,spoon,carbide,approved,abc,2,22,60,6,0,30,,,,,,";
const fixed2 = "Import fixed,ball,hss,proposed,6,2,18,60,6,3,30,,,,,,";

const csv = (...lines: string[]) => `${lines.join("\n")}\n`;

let team: Team;
const base = () => `/api/shops/${team.shopId}/cutters`;

async function listAll(t: Team): Promise<Cutter[]> {
  return cutterPageSchema.parse((await t.owner.agent.get(`/api/shops/${t.shopId}/cutters`).query({ pageSize: 200 })).body).items;
}

function upload(t: Team, body: string | Buffer, query: Record<string, string> = {}, role: keyof Omit<Team, "shopId"> = "tooling_manager", filename = "cutters.csv", contentType = "text/csv") {
  return t[role].agent
    .post(`/api/shops/${t.shopId}/cutters/import`)
    .query(query)
    .attach("file", Buffer.isBuffer(body) ? body : Buffer.from(body, "utf8"), { filename, contentType });
}

beforeAll(async () => {
  team = await teamShop(app, "csv");
});

describe("POST /cutters/import — all or nothing, with a preview", () => {
  it("previews every row with its line and per-column errors and writes nothing (dry run)", async () => {
    const res = await upload(team, csv(HEADER, good1, bad2, good3), { dryRun: "true" });
    expect(res.status).toBe(200);
    const report = cutterImportReportSchema.parse(res.body);
    expect(report).toMatchObject({ dryRun: true, fileErrors: [], counts: { total: 3, valid: 2, invalid: 1 }, imported: 0 });
    expect(report.rows.map((r) => r.line)).toEqual([2, 3, 4]);
    expect(report.rows[0]!.errors).toEqual({});
    expect(report.rows[0]!.cutter).toMatchObject({ name: "Import 6 mm flat", diameterMm: 6, status: "approved", maxRpm: 24000, tipAngleDeg: null });
    expect(report.rows[1]!.errors).toEqual({
      shape: "Unknown shape “spoon”. Use one of: flat, ball, bull_nose, vee, chamfer, drill, compression, up_spiral, down_spiral.",
      diameter_mm: "“abc” is not a number.",
    });
    expect(report.rows[1]!.values).toMatchObject({ name: "Import broken", shape: "spoon", diameter_mm: "abc" });
    expect(report.rows[1]!.cutter).toBeNull();
    // A blank status becomes approved (imports are for tooling managers and owners).
    expect(report.rows[2]!.cutter).toMatchObject({ status: "approved", tipAngleDeg: 60, notes: "Engraving, labels", partNumber: "VB-60" });
    expect(await listAll(team)).toEqual([]);
  });

  it("refuses the whole file with 400 and the same report when any row is bad", async () => {
    const res = await upload(team, csv(HEADER, good1, bad2, good3));
    expect(res.status).toBe(400);
    const body = cutterImportErrorSchema.parse(res.body);
    expect(body.error).toEqual({
      code: "validation_failed",
      message: "1 row of 3 has errors; nothing was imported. Fix it and upload the file again.",
    });
    expect(body.report).toMatchObject({ dryRun: false, counts: { total: 3, valid: 2, invalid: 1 }, imported: 0 });
    expect(body.report.rows[1]!.line).toBe(3);
    expect(await listAll(team)).toEqual([]);
  });

  it("imports every row of the fixed file in one go", async () => {
    const res = await upload(team, csv(HEADER, good1, fixed2, good3));
    expect(res.status).toBe(201);
    const report = cutterImportReportSchema.parse(res.body);
    expect(report).toMatchObject({ dryRun: false, imported: 3, counts: { total: 3, valid: 3, invalid: 0 } });
    const cutters = await listAll(team);
    expect(cutters.map((c) => [c.name, c.status])).toEqual([
      ["Import 6 mm flat", "approved"],
      ["Import 60° vee", "approved"],
      ["Import fixed", "proposed"],
    ]);
    // The same file again: warned as likely duplicates, not refused.
    const again = cutterImportReportSchema.parse((await upload(team, csv(HEADER, good1), { dryRun: "1" })).body);
    expect(again.rows[0]!.warnings).toEqual(["The shop already has a cutter with this name."]);
  });

  it("reads inch columns exactly (1 in = 25.4 mm) and refuses a length given both ways", async () => {
    const shop = await teamShop(app, "csv-inch");
    const header = "name,shape,tool_material,diameter_in,flutes,flute_length_in,overall_length_in,shank_diameter_in,corner_radius_mm";
    const res = await upload(shop, csv(header, "Quarter inch,up spiral,Carbide,0.25,2,0.875,2.5,0.25,0", "Eighth inch,down-spiral,HSS,.125,1,0.5,1.5,0.125,"));
    expect(res.status).toBe(201);
    const byName = new Map((await listAll(shop)).map((c) => [c.name, c]));
    // Expected values by hand from the definition of the inch (NIST SP 811, exact): 0.25 in = 6.35 mm,
    // 0.875 in = 22.225 mm, 2.5 in = 63.5 mm, 0.125 in = 3.175 mm, 0.5 in = 12.7 mm, 1.5 in = 38.1 mm.
    const q = byName.get("Quarter inch")!;
    expect(q.shape).toBe("up_spiral");
    expect(q.diameterMm).toBeCloseTo(6.35, 12);
    expect(q.fluteLengthMm).toBeCloseTo(22.225, 12);
    expect(q.overallLengthMm).toBeCloseTo(63.5, 12);
    const e = byName.get("Eighth inch")!;
    expect([e.shape, e.toolMaterial]).toEqual(["down_spiral", "hss"]);
    expect(e.diameterMm).toBeCloseTo(3.175, 12);
    expect(e.overallLengthMm).toBeCloseTo(38.1, 12);

    const both = await upload(shop, csv(`${header},diameter_mm`, "Both,flat,carbide,0.25,2,0.875,2.5,0.25,0,6.35"), { dryRun: "true" });
    expect(cutterImportReportSchema.parse(both.body).rows[0]!.errors).toEqual({ diameter_in: "Give diameter in mm or in inches, not both." });
    // Range messages name the conversion when the user wrote inches.
    const huge = await upload(shop, csv(header, "Huge,flat,carbide,5,2,0.875,2.5,0.25,0"), { dryRun: "true" });
    expect(cutterImportReportSchema.parse(huge.body).rows[0]!.errors).toEqual({
      diameter_in: "diameter must be at most 100 (after converting to mm)",
    });
  });

  it("reports file-level problems: unknown and missing columns, no rows, broken quoting, not UTF-8", async () => {
    const report = async (body: string | Buffer) => cutterImportReportSchema.parse((await upload(team, body, { dryRun: "true" })).body);
    expect((await report(csv("name,shape,tool_material,diameter,flutes,flute_length_mm,overall_length_mm,shank_diameter_mm", "A,flat,carbide,6,2,20,60,6"))).fileErrors).toEqual([
      "Unknown column: diameter. Use the columns in the cutter CSV guide (lengths end in _mm or _in).",
      "Missing column: diameter_mm or diameter_in.",
    ]);
    expect((await report(csv(HEADER))).fileErrors).toEqual(["The file has no cutter rows under the header."]);
    expect((await report('name,shape\n"unclosed,flat\n')).fileErrors[0]).toMatch(/^The file is not valid CSV/);
    expect((await report(Buffer.from([0x6e, 0x61, 0x6d, 0x65, 0x0a, 0xff, 0xfe, 0x41]))).fileErrors).toEqual([
      "The file is not UTF-8 text. Save it as “CSV UTF-8” and try again.",
    ]);
    const refused = await upload(team, csv(HEADER.replace("notes", "colour"), good1));
    expect(refused.status).toBe(400);
    expect(cutterImportErrorSchema.parse(refused.body).error.message).toMatch(/^Unknown column: colour\..*Nothing was imported\.$/);
  });

  it("counts lines across quoted line breaks and reports a row with the wrong number of cells", async () => {
    const body = csv(HEADER, 'Multi,flat,carbide,,6,2,22,60,6,0,30,,,,,,"line one\nline two"', "Short,flat,carbide");
    const report = cutterImportReportSchema.parse((await upload(team, body, { dryRun: "true" })).body);
    expect(report.rows.map((r) => r.line)).toEqual([2, 4]);
    expect(report.rows[0]!.cutter?.notes).toBe("line one\nline two");
    expect(report.rows[1]!.errors.row).toBe("This row has 3 cells; the header has 17.");
  });

  it("accepts semicolon-separated files with decimal commas (as spreadsheets write them in many locales)", async () => {
    const shop = await teamShop(app, "csv-semi");
    const body = "name;shape;tool_material;diameter_mm;flutes;flute_length_mm;overall_length_mm;shank_diameter_mm\r\nKomma;flat;carbide;3,175;2;12,7;38,1;3,175\r\n";
    expect((await upload(shop, `\uFEFF${body}`)).status).toBe(201);
    expect((await listAll(shop))[0]).toMatchObject({ name: "Komma", diameterMm: 3.175, fluteLengthMm: 12.7 });
  });

  it("checks the upload: roles, a file present, its type and its size", async () => {
    expect((await upload(team, csv(HEADER, good1), {}, "programmer")).status).toBe(403);
    expect((await upload(team, csv(HEADER, good1), {}, "operator")).status).toBe(403);

    const none = await team.owner.agent.post(`${base()}/import`).field("note", "no file");
    expect(none.status).toBe(400);
    expect(apiErrorSchema.parse(none.body).error.fields).toEqual({ file: "Choose a CSV file" });

    const png = await upload(team, Buffer.from([0x89, 0x50, 0x4e, 0x47]), {}, "owner", "photo.png", "image/png");
    expect(png.status).toBe(415);
    expect(apiErrorSchema.parse(png.body).error.message).toBe("Upload a .csv file (this one is image/png).");

    const json = await team.owner.agent.post(`${base()}/import`).send({ file: "name,shape" });
    expect(json.status).toBe(415);

    const big = await upload(team, Buffer.alloc(MAX_CSV_BYTES + 1, "a"), {}, "owner");
    expect(big.status).toBe(413);
    expect(apiErrorSchema.parse(big.body).error.message).toBe("The file is larger than 1 MiB; split the list.");

    const badFlag = await upload(team, csv(HEADER, good1), { dryRun: "perhaps" }, "owner");
    expect(badFlag.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(badFlag.body).error.fields ?? {})).toEqual(["query.dryRun"]);
  });
});

describe("GET /cutters/export", () => {
  let source: Team;
  beforeAll(async () => {
    source = await teamShop(app, "csv-export");
    const body = csv(
      HEADER,
      good1,
      fixed2,
      good3,
      "Formula note,drill,hss,retired,5,2,52,86,5,,30,118,,TiN,,,=SUM(A1:A2)",
      "1/8 in up-cut,up_spiral,carbide,approved,3.175,1,12.7,38.1,3.175,0,30,,30000,,,,",
    );
    expect((await upload(source, body)).status).toBe(201);
  });

  it("downloads CSV for any member with the documented columns", async () => {
    const res = await source.operator.agent.get(`/api/shops/${source.shopId}/cutters/export`);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("text/csv; charset=utf-8");
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename="cutters-\d{4}-\d{2}-\d{2}\.csv"$/);
    const rows = parse(res.text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(Object.keys(rows[0]!).join(",")).toBe(HEADER);
    expect(rows).toHaveLength(5);
    const formula = rows.find((r) => r.name === "Formula note")!;
    // Spreadsheet formulas are defused on the way out…
    expect(formula.notes).toBe("'=SUM(A1:A2)");
    expect(formula.status).toBe("retired");
  });

  it("round-trips: metric export → import into another shop → the same export", async () => {
    const first = (await source.owner.agent.get(`/api/shops/${source.shopId}/cutters/export`)).text;
    const target = await teamShop(app, "csv-roundtrip");
    const imported = await upload(target, first);
    expect(imported.status).toBe(201);
    expect(cutterImportReportSchema.parse(imported.body).imported).toBe(5);
    const second = (await target.owner.agent.get(`/api/shops/${target.shopId}/cutters/export`)).text;
    expect(second).toBe(first);
    // …and restored on the way in.
    const back = (await listAll(target)).find((c) => c.name === "Formula note")!;
    expect(back.notes).toBe("=SUM(A1:A2)");
  });

  it("writes inch columns for imperial shops, and those import back to the same millimetres", async () => {
    const res = await source.owner.agent.get(`/api/shops/${source.shopId}/cutters/export`).query({ units: "imperial" });
    expect(res.headers["content-disposition"]).toMatch(/-inch\.csv"$/);
    const rows = parse(res.text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(Object.keys(rows[0]!)).toContain("diameter_in");
    expect(Object.keys(rows[0]!)).not.toContain("diameter_mm");
    // 3.175 mm / 25.4 = 0.125 in exactly; 12.7 mm = 0.5 in; 38.1 mm = 1.5 in (hand arithmetic).
    expect(rows.find((r) => r.name === "1/8 in up-cut")).toMatchObject({ diameter_in: "0.125", flute_length_in: "0.5", overall_length_in: "1.5" });

    const target = await teamShop(app, "csv-imperial");
    expect((await upload(target, res.text)).status).toBe(201);
    const before = new Map((await listAll(source)).map((c) => [c.name, c]));
    for (const c of await listAll(target)) {
      const original = before.get(c.name)!;
      // Inches are written to 1e-6 in, so lengths come back within 1e-6 × 25.4 mm.
      for (const key of ["diameterMm", "fluteLengthMm", "overallLengthMm", "shankDiameterMm", "cornerRadiusMm"] as const) {
        expect(Math.abs(c[key] - original[key]), `${c.name} ${key}`).toBeLessThanOrEqual(25.4e-6);
      }
      expect([c.status, c.flutes, c.maxRpm, c.tipAngleDeg]).toEqual([original.status, original.flutes, original.maxRpm, original.tipAngleDeg]);
    }
  });

  it("filters by status and validates its query", async () => {
    const res = await source.owner.agent.get(`/api/shops/${source.shopId}/cutters/export`).query({ status: "retired" });
    const rows = parse(res.text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(rows.map((r) => r.name)).toEqual(["Formula note"]);
    const bad = await source.owner.agent.get(`/api/shops/${source.shopId}/cutters/export`).query({ units: "cubits" });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {})).toEqual(["query.units"]);
  });
});
