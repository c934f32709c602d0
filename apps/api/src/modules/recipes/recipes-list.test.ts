import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { apiErrorSchema, recipeListQuerySchema, recipePageSchema, recipeSchema, type Recipe } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { insertAssembly, insertCutter, libraryFor } from "./recipe-test-fixtures.js";
import { recipeListSql } from "./recipes.repository.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let owner: SignedUp;
let operator: SignedUp;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let balloId: string;
const made: Record<string, Recipe> = {};
const url = (query = "") => `/api/shops/${owner.shopId}/recipes${query}`;

async function setStatus(id: string, status: string): Promise<void> {
  await getSequelize().query(`UPDATE recipes SET status = :status WHERE id = :id`, { replacements: { id, status } });
}

beforeAll(async () => {
  owner = await createPerson(app, "list-owner", "List shop");
  operator = await createPerson(app, "list-op");
  await joinShop(operator.userId, owner.shopId, "operator");
  lib = await libraryFor(owner.shopId);
  const ballId = await insertCutter(owner.shopId, { name: "Test 3 mm ball", shape: "ball", diameterMm: 3, fluteLengthMm: 9 });
  balloId = await insertAssembly(owner.shopId, lib.millId, ballId, 15);
  const specs = [
    { key: "a", name: "Alpha slot 100% off", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "slot", params: { axialDepthMm: 1, radialDepthMm: 6 }, notes: "" },
    { key: "b", name: "Bravo profile", assemblyId: lib.routerAssemblyId, materialId: lib.mdfId, operation: "profile", params: { axialDepthMm: 6, radialDepthMm: 3 }, notes: "clamp the sheet corners" },
    { key: "c", name: "Charlie finish", assemblyId: lib.millAssemblyId, materialId: lib.aluminiumId, operation: "finish", params: { axialDepthMm: 6, radialDepthMm: 0.3 }, notes: "" },
    { key: "d", name: "Delta surfacing", assemblyId: balloId, materialId: lib.aluminiumId, operation: "finish", params: { axialDepthMm: 0.3, radialDepthMm: 0.3 }, notes: "" },
  ];
  for (const { key, ...body } of specs) {
    const res = await owner.agent.post(url()).send(body);
    if (res.status !== 201) throw new Error(JSON.stringify(res.body));
    made[key] = recipeSchema.parse(res.body);
  }
  await setStatus(made.a!.id, "approved");
  await setStatus(made.c!.id, "approved");
  await setStatus(made.d!.id, "trial");
});

const ids = (page: { items: Array<{ id: string }> }) => page.items.map((r) => r.id);
async function list(query: string, who: SignedUp = owner) {
  const res = await who.agent.get(url(query));
  expect(res.status).toBe(200);
  return recipePageSchema.parse(res.body);
}

describe("GET recipes (server-side filters, sort and pages)", () => {
  it("lists newest first by default with the page envelope", async () => {
    const page = await list("");
    expect(page).toMatchObject({ page: 1, pageSize: 25, total: 4 });
    expect(ids(page)).toEqual([made.d!.id, made.c!.id, made.b!.id, made.a!.id].filter((id) => ids(page).includes(id)));
  });

  it("gives each row the recipe's headline numbers and leaves parameters and warnings to the recipe itself", async () => {
    const res = await owner.agent.get(url("?q=Bravo"));
    const row = res.body.items[0] as Record<string, unknown>;
    expect(row).not.toHaveProperty("params");
    expect(row.result).not.toHaveProperty("warnings");
    const full = recipeSchema.parse((await owner.agent.get(url(`/${made.b!.id}`)).expect(200)).body);
    const { rpm, feedMmPerMin, chipLoadMm, materialRemovalRateMm3PerMin, powerW, stable } = full.result;
    expect(recipePageSchema.parse(res.body).items[0]!.result).toEqual({ rpm, feedMmPerMin, chipLoadMm, materialRemovalRateMm3PerMin, powerW, stable });
  });

  it("filters by machine, material, cutter, operation and status", async () => {
    expect(ids(await list(`?machineId=${lib.millId}`)).sort()).toEqual([made.c!.id, made.d!.id].sort());
    expect(ids(await list(`?materialId=${lib.mdfId}`))).toEqual([made.b!.id]);
    expect(ids(await list(`?cutterId=${lib.cutterId}`)).sort()).toEqual([made.a!.id, made.b!.id, made.c!.id].sort());
    expect(ids(await list("?operation=finish")).sort()).toEqual([made.c!.id, made.d!.id].sort());
    expect(ids(await list("?status=trial"))).toEqual([made.d!.id]);
    expect(ids(await list(`?status=approved&machineId=${lib.routerId}`))).toEqual([made.a!.id]);
  });

  it("searches names, notes, cutter and material names, matching % and _ literally", async () => {
    expect(ids(await list("?q=bravo"))).toEqual([made.b!.id]);
    expect(ids(await list("?q=SHEET%20corners"))).toEqual([made.b!.id]);
    expect(ids(await list("?q=3%20mm%20ball"))).toEqual([made.d!.id]);
    expect(ids(await list("?q=MDF"))).toEqual([made.b!.id]);
    expect(ids(await list("?q=100%25"))).toEqual([made.a!.id]);
    expect(ids(await list("?q=%25"))).toEqual([made.a!.id]);
    expect((await list("?q=zzz-nothing")).total).toBe(0);
  });

  it("sorts by name, speed, status and machine name in either direction", async () => {
    expect(ids(await list("?sort=name&order=asc"))).toEqual(["a", "b", "c", "d"].map((k) => made[k]!.id));
    expect(ids(await list("?sort=name&order=desc"))).toEqual(["d", "c", "b", "a"].map((k) => made[k]!.id));
    const byRpm = (await list("?sort=rpm&order=desc")).items.map((r) => r.result.rpm);
    expect(byRpm).toEqual([...byRpm].sort((x, y) => y - x));
    // Life-cycle order: draft, trial, proven, approved.
    expect((await list("?sort=status&order=asc")).items.map((r) => r.status)).toEqual(["draft", "trial", "approved", "approved"]);
    expect((await list("?sort=machineName&order=asc")).items.map((r) => r.machineName)).toEqual([
      "Test bench mill",
      "Test bench mill",
      "Test gantry router",
      "Test gantry router",
    ]);
  });

  it("pages with a total", async () => {
    const first = await list("?sort=name&order=asc&pageSize=3");
    const second = await list("?sort=name&order=asc&pageSize=3&page=2");
    expect(first).toMatchObject({ total: 4, page: 1, pageSize: 3 });
    expect(ids(first)).toHaveLength(3);
    expect(ids(second)).toEqual([made.d!.id]);
  });

  it("shows operators approved recipes only, whatever they filter for", async () => {
    expect(ids(await list("?sort=name&order=asc", operator))).toEqual([made.a!.id, made.c!.id]);
    expect((await list("?status=trial", operator)).total).toBe(0);
  });

  it("answers 400 naming bad query fields", async () => {
    const res = await owner.agent.get(url("?status=shiny&sort=colour&pageSize=500&machineId=x"));
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {}).sort()).toEqual(["query.machineId", "query.pageSize", "query.sort", "query.status"]);
  });
});

type PlanNode = { "Node Type": string; "Relation Name"?: string; "Index Name"?: string; Plans?: PlanNode[] };

function nodes(plan: PlanNode): PlanNode[] {
  return [plan, ...(plan.Plans ?? []).flatMap(nodes)];
}

/** "Limit(Sort(Index Scan recipes_list_name_idx))"-style outline of a plan, for failure messages. */
function outline(plan: PlanNode): string {
  const self = `${plan["Node Type"]}${plan["Index Name"] ? ` ${plan["Index Name"]}` : plan["Relation Name"] ? ` ${plan["Relation Name"]}` : ""}`;
  return plan.Plans?.length ? `${self}(${plan.Plans.map(outline).join(", ")})` : self;
}

describe("list queries on a shop with 10 000 recipes are served by indexes", () => {
  let bigShop: SignedUp;

  beforeAll(async () => {
    bigShop = await createPerson(app, "big-owner", "Ten thousand recipes");
    const other = await createPerson(app, "big-other", "Another big shop");
    const mine = await libraryFor(bigShop.shopId);
    const theirs = await libraryFor(other.shopId);
    const template = made.b!;
    // One INSERT: 10 000 recipes in this shop and 10 000 in another, spread over machines,
    // materials, operations, statuses and a year of update times.
    await getSequelize().query(
      `INSERT INTO recipes (shop_id, name, assembly_id, machine_id, cutter_id, material_id, operation, status, params, result, rpm, feed_mm_per_min, notes, author_id, updated_at)
       SELECT s.shop_id, 'Recipe ' || g || ' ' || md5(g::text), s.assembly_id, s.machine_id, s.cutter_id,
              CASE WHEN g % 3 = 0 THEN s.mdf_id ELSE s.aluminium_id END,
              (ARRAY['slot','profile','adaptive','pocket','finish'])[1 + g % 5],
              (ARRAY['draft','trial','proven','approved','retired'])[1 + (g / 7) % 5],
              :params, :result, 8000 + g % 16000, 500 + g % 5000, 'note ' || g, s.author_id,
              now() - (g || ' minutes')::interval
         FROM generate_series(1, 20000) AS g
         JOIN (VALUES (0, :mine::uuid, :mineAssembly::uuid, :mineMachine::uuid, :mineCutter::uuid, :mineAl::uuid, :mineMdf::uuid, :mineAuthor::uuid),
                      (1, :theirs::uuid, :theirAssembly::uuid, :theirMachine::uuid, :theirCutter::uuid, :theirAl::uuid, :theirMdf::uuid, :theirAuthor::uuid))
              AS s (k, shop_id, assembly_id, machine_id, cutter_id, aluminium_id, mdf_id, author_id) ON s.k = g % 2`,
      {
        replacements: {
          params: JSON.stringify(template.params),
          result: JSON.stringify(template.result),
          mine: bigShop.shopId,
          mineAssembly: mine.routerAssemblyId,
          mineMachine: mine.routerId,
          mineCutter: mine.cutterId,
          mineAl: mine.aluminiumId,
          mineMdf: mine.mdfId,
          mineAuthor: bigShop.userId,
          theirs: other.shopId,
          theirAssembly: theirs.routerAssemblyId,
          theirMachine: theirs.routerId,
          theirCutter: theirs.cutterId,
          theirAl: theirs.aluminiumId,
          theirMdf: theirs.mdfId,
          theirAuthor: other.userId,
        },
      },
    );
    // As autovacuum leaves a table in steady state: statistics and the visibility map up to date.
    await getSequelize().query("VACUUM ANALYZE recipes");
    await getSequelize().query("ANALYZE cut_logs; ANALYZE cutters; ANALYZE materials; ANALYZE machines; ANALYZE users;");
  });

  const shapes: Array<[string, Record<string, string>, boolean]> = [
    ["default: newest first", {}, false],
    ["operator: approved, newest first", {}, true],
    ["status filter", { status: "trial" }, false],
    ["machine filter", { machineId: "MACHINE" }, false],
    ["material filter sorted by name", { materialId: "MATERIAL", sort: "name", order: "asc" }, false],
    ["operation filter sorted by rpm", { operation: "pocket", sort: "rpm" }, false],
    ["free text", { q: "9999" }, false],
    ["sorted by machine name", { sort: "machineName", order: "asc" }, false],
    ["last page", { page: "400" }, false],
  ];

  it.each(shapes)("%s: no sequential scan of recipes", async (_label, raw, approvedOnly) => {
    const mine = await getSequelize().query<{ id: string }>(`SELECT machine_id AS id FROM recipes WHERE shop_id = :s LIMIT 1`, {
      replacements: { s: bigShop.shopId },
      type: QueryTypes.SELECT,
    });
    const material = await getSequelize().query<{ id: string }>(`SELECT material_id AS id FROM recipes WHERE shop_id = :s LIMIT 1`, {
      replacements: { s: bigShop.shopId },
      type: QueryTypes.SELECT,
    });
    const resolved = Object.fromEntries(
      Object.entries(raw).map(([k, v]) => [k, v === "MACHINE" ? mine[0]!.id : v === "MATERIAL" ? material[0]!.id : v]),
    );
    const query = recipeListQuerySchema.parse(resolved);
    const sql = recipeListSql(bigShop.shopId, query, approvedOnly);
    for (const statement of [sql.page, sql.count]) {
      // Whether the planner prefers an index or a scan of the whole table depends on statistics
      // and on how much of the visibility map VACUUM could set while other test files hold
      // transactions open on this database. What this test pins down is that an index CAN serve
      // each query shape: with sequential scans priced as a last resort, the planner still picks
      // one when no index fits, so a Seq Scan here means a missing or unusable index.
      const row = await getSequelize().transaction(async (transaction) => {
        await getSequelize().query("SET LOCAL enable_seqscan = off", { transaction });
        const [explained] = await getSequelize().query<{ "QUERY PLAN": Array<{ Plan: PlanNode }> }>(`EXPLAIN (ANALYZE, FORMAT JSON) ${statement}`, {
          replacements: sql.replacements,
          type: QueryTypes.SELECT,
          transaction,
        });
        return explained;
      });
      const plan = row!["QUERY PLAN"][0]!.Plan;
      if (process.env.SHOW_PLANS) console.log(_label, "::", outline(plan));
      const onRecipes = nodes(plan).filter((n) => n["Relation Name"] === "recipes");
      expect(onRecipes.filter((n) => n["Node Type"] === "Seq Scan").length, outline(plan)).toBe(0);
      expect(nodes(plan).some((n) => /Index/.test(n["Node Type"]) && /^recipes_/.test(n["Index Name"] ?? "")), outline(plan)).toBe(true);
    }
    // And the route answers with the right page.
    const page = recipePageSchema.parse((await bigShop.agent.get(`/api/shops/${bigShop.shopId}/recipes?${new URLSearchParams(resolved)}`).expect(200)).body);
    expect(page.total).toBeGreaterThan(0);
  });
});
