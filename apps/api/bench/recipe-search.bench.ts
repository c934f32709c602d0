/**
 * Recipe search at scale: 100 000 recipes over 20 shops, the recipe list route
 * (GET /api/shops/:shopId/recipes) under 50 concurrent connections with a mix of filters, sorts,
 * pages and free text, through the real API (built dist/server.js, real HTTP on loopback) and
 * through a bare node:http + pg handler running the same SQL; then the ratio of the two. Also
 * prints the plans PostgreSQL chooses for the main query shapes. Figures only; nothing asserted.
 *
 *   npm run bench:search -w @ringdown/api     (RINGDOWN_BENCH_SECONDS=5 for a short run)
 *
 * Environment: RINGDOWN_BENCH_DATABASE_URL (default …/ringdown_bench on the test cluster),
 * RINGDOWN_BENCH_SECONDS (20 per server), RINGDOWN_BENCH_FRESH=1 rebuilds the data,
 * RINGDOWN_BENCH_API_PORT (3990) and RINGDOWN_BENCH_BARE_PORT (3991).
 */
import { QueryTypes } from "sequelize";
import { recipeListQuerySchema, type RecipeListQuery } from "@ringdown/contracts";
import { getSequelize } from "../src/db/sequelize.js";
import { recipeListSql } from "../src/modules/recipes/recipes.repository.js";
import { BENCH_PASSWORD, closeBenchDatabase, prepareBenchDatabase, type BenchShop } from "./bench-data.js";
import { listKind, listQuery } from "./request-mix.js";
import {
  benchSeconds,
  machineLine,
  percentile,
  pick,
  printLoad,
  runLoad,
  runPaced,
  seededRandom,
  signIn,
  startApi,
  mergeLoads,
  startServer,
  type LoadResult,
  type PlannedRequest,
} from "./load.js";

const CONNECTIONS = 50;
const seconds = benchSeconds(20);
const apiPort = Number(process.env.RINGDOWN_BENCH_API_PORT ?? 3990);
const barePort = Number(process.env.RINGDOWN_BENCH_BARE_PORT ?? 3991);

console.log(`Recipe search at scale — ${machineLine()}`);
const data = await prepareBenchDatabase({ fresh: process.env.RINGDOWN_BENCH_FRESH === "1" });
const shops = data.shops;

// ---------------------------------------------------------------- the request mix

// ---------------------------------------------------------------- plans

type PlanNode = { "Node Type": string; "Relation Name"?: string; "Index Name"?: string; Plans?: PlanNode[] };
const planNodes = (plan: PlanNode): PlanNode[] => [plan, ...(plan.Plans ?? []).flatMap(planNodes)];
function planOutline(plan: PlanNode): string {
  const self = `${plan["Node Type"]}${plan["Index Name"] ? ` ${plan["Index Name"]}` : plan["Relation Name"] ? ` ${plan["Relation Name"]}` : ""}`;
  return plan.Plans?.length ? `${self}(${plan.Plans.map(planOutline).join(", ")})` : self;
}

async function printPlans(shop: BenchShop): Promise<void> {
  const shapes: Array<[string, Record<string, string>, boolean]> = [
    ["first page, newest first", {}, false],
    ["operator: approved only", {}, true],
    ["status filter", { status: "trial" }, false],
    ["machine filter", { machineId: shop.machineIds[0]! }, false],
    ["material filter, by name", { materialId: shop.materialIds[0]!, sort: "name", order: "asc" }, false],
    ["operation filter, by speed", { operation: "pocket", sort: "rpm" }, false],
    ["free text", { q: "bracket" }, false],
    ["free text, job number", { q: "4711" }, false],
    ["sorted by machine name", { sort: "machineName", order: "asc" }, false],
    ["page 150", { page: "150" }, false],
  ];
  console.log(`\n  Plans (EXPLAIN ANALYZE in a shop of ${(await countRecipes(shop.id)).toLocaleString("en")} live recipes; planner left to choose)`);
  for (const [label, raw, approvedOnly] of shapes) {
    const query: RecipeListQuery = recipeListQuerySchema.parse(raw);
    const sql = recipeListSql(shop.id, query, approvedOnly);
    for (const [part, statement] of [["page", sql.page], ["count", sql.count]] as const) {
      const [row] = await getSequelize().query<{ "QUERY PLAN": Array<{ Plan: PlanNode; "Execution Time": number }> }>(
        `EXPLAIN (ANALYZE, FORMAT JSON) ${statement}`,
        { replacements: sql.replacements, type: QueryTypes.SELECT },
      );
      const explained = row!["QUERY PLAN"][0]!;
      const nodes = planNodes(explained.Plan);
      const seqOnRecipes = nodes.some((n) => n["Node Type"] === "Seq Scan" && n["Relation Name"] === "recipes");
      const indexes = [...new Set(nodes.map((n) => n["Index Name"]).filter((n): n is string => !!n && n.startsWith("recipes_")))];
      const verdict = seqOnRecipes ? "SEQUENTIAL SCAN of recipes" : indexes.length ? `index: ${indexes.join(", ")}` : "no recipes index";
      console.log(`  ${`${label} (${part})`.padEnd(40)} ${explained["Execution Time"].toFixed(2).padStart(8)} ms  ${verdict}`);
      if (process.env.RINGDOWN_BENCH_PLAN_OUTLINES !== "0") console.log(`      ${planOutline(explained.Plan)}`);
    }
  }
}

async function countRecipes(shopId: string): Promise<number> {
  const [row] = await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM recipes WHERE shop_id = :shopId AND deleted_at IS NULL`, {
    replacements: { shopId },
    type: QueryTypes.SELECT,
  });
  return row!.n;
}

await printPlans(shops[0]!);
await closeBenchDatabase();

// ---------------------------------------------------------------- load

interface Reader {
  shop: BenchShop;
  cookie: string;
  operator: boolean;
}

/** The same request sequence for both servers (same seed); only the address and auth differ. */
function mix(readers: Reader[], bare: boolean): () => PlannedRequest {
  const random = seededRandom(20_260_101);
  return () => {
    const reader = pick(random, readers);
    const query = listQuery(random, reader.shop);
    const search = new URLSearchParams(query).toString();
    const path = `${bare ? "" : "/api"}/shops/${reader.shop.id}/recipes${search ? `?${search}` : ""}`;
    const headers: Record<string, string> = bare ? (reader.operator ? { "x-approved-only": "1" } : {}) : { cookie: reader.cookie };
    return { kind: listKind(query), method: "GET", path, headers };
  };
}

// Both servers run side by side; the load alternates between them in rounds, so a change in what
// else the (shared) machine is doing hits both alike.
const api = await startApi(data.databaseUrl, apiPort);
const bare = await startServer(
  "the bare handler",
  process.execPath,
  ["--import", "tsx", "bench/bare-recipe-server.ts"],
  { DATABASE_URL: data.databaseUrl, PORT: String(barePort), NODE_OPTIONS: "--conditions=source" },
  barePort,
  "/health",
);
try {
  // One programmer (sees every status) and one operator (approved recipes only) per shop, signed in over HTTP.
  const readers: Reader[] = [];
  for (const shop of shops) {
    for (const role of ["programmer", "operator"] as const) {
      const person = shop.people.find((p) => p.role === role)!;
      readers.push({ shop, operator: role === "operator", cookie: await signIn(api.baseUrl, person.email, BENCH_PASSWORD) });
    }
  }
  const rounds = Math.max(1, Math.round(seconds / 5));
  const slice = seconds / rounds;
  console.log(`\n  ${readers.length} people signed in; ${CONNECTIONS} connections, ${seconds} s per server in ${rounds} alternating rounds (after a 3 s warm-up each)`);
  const apiMix = mix(readers, false);
  const bareMix = mix(readers, true);
  await runLoad(api.baseUrl, CONNECTIONS, 3, apiMix);
  await runLoad(bare.baseUrl, CONNECTIONS, 3, bareMix);
  const apiRuns: LoadResult[] = [];
  const bareRuns: LoadResult[] = [];
  for (let round = 0; round < rounds; round++) {
    apiRuns.push(await runLoad(api.baseUrl, CONNECTIONS, slice, apiMix));
    bareRuns.push(await runLoad(bare.baseUrl, CONNECTIONS, slice, bareMix));
  }
  const apiResult = mergeLoads(apiRuns);
  const bareResult = mergeLoads(bareRuns);
  printLoad("API (Express, session, membership check, response schema): GET /api/shops/:shopId/recipes, as fast as answered", apiResult);
  printLoad("Bare handler (node:http + pg Pool, same SQL and parameters, no framework, no auth), as fast as answered", bareResult);

  // Evenly paced requests over up to the same 50 connections at half the API's saturated
  // throughput: what a person waits for when the server is busy but not overrun.
  const paced = Math.max(1, Math.round(apiResult.requestsPerSecond / 2));
  const pacedResult = await runPaced(api.baseUrl, CONNECTIONS, seconds, paced, apiMix);
  printLoad(`API paced evenly at ${paced} requests/s (up to ${CONNECTIONS} connections)`, pacedResult);

  const apiP95 = percentile(apiResult.all.latencies, 95);
  const ratio = apiResult.requestsPerSecond / bareResult.requestsPerSecond;
  console.log(`\n  Summary`);
  console.log(`  API throughput ${apiResult.requestsPerSecond.toFixed(1)} requests/s; p50 / p95 / p99 ${[50, 95, 99].map((p) => percentile(apiResult.all.latencies, p).toFixed(1)).join(" / ")} ms`);
  console.log(`  p95 at saturation ${apiP95.toFixed(1)} ms (target under 50 ms: ${apiP95 < 50 ? "met" : "MISSED"}); p95 paced at ${paced} requests/s ${percentile(pacedResult.all.latencies, 95).toFixed(1)} ms`);
  console.log(`  API / bare throughput ${apiResult.requestsPerSecond.toFixed(1)} / ${bareResult.requestsPerSecond.toFixed(1)} = ${ratio.toFixed(2)} (target at least 0.5: ${ratio >= 0.5 ? "met" : "MISSED"})`);
  console.log(`  ${machineLine()}`);
} finally {
  await api.stop();
  await bare.stop();
}
