/**
 * Mixed workload: people of 20 shops reading and writing through the real API at once — recipe
 * lists and searches, recipe pages and their cut logs, recommendations (the engine runs on the
 * server), new recipes, edits (new revisions, recomputed) and cut logs — at 100 concurrent
 * connections for 60 s. Prints total requests, answers other than 2xx, and p50/p95/p99 latency
 * per kind of request. Figures only; nothing asserted.
 *
 *   npm run bench:mixed -w @ringdown/api     (RINGDOWN_BENCH_SECONDS=5 for a short run)
 *
 * Uses the recipe-search benchmark's database (prepared here if missing); the same environment
 * variables apply except RINGDOWN_BENCH_FRESH, plus RINGDOWN_BENCH_MIXED_PORT (3992).
 */
import { QueryTypes } from "sequelize";
import type { Operation, RecipeParams } from "@ringdown/contracts";
import { getSequelize } from "../src/db/sequelize.js";
import { BENCH_PASSWORD, closeBenchDatabase, PARTS, prepareBenchDatabase, type BenchShop } from "./bench-data.js";
import { benchSeconds, machineLine, percentile, pick, printLoad, runLoad, seededRandom, signIn, startApi, type PlannedRequest } from "./load.js";
import { listQuery } from "./request-mix.js";

const CONNECTIONS = 100;
const seconds = benchSeconds(60);
const port = Number(process.env.RINGDOWN_BENCH_MIXED_PORT ?? 3992);

console.log(`Mixed workload — ${machineLine()}`);
// Reuses the search benchmark's data when it is there (RINGDOWN_BENCH_FRESH applies to that one).
const data = await prepareBenchDatabase();

interface ShopWork {
  shop: BenchShop;
  /** Approved recipes: every member reads them and logs cuts on them. */
  approved: string[];
  /** Drafts and recipes on trial with their parameters: programmers edit them (an edit of an approved recipe's cut would send it back to trial). */
  editable: Array<{ id: string; params: RecipeParams }>;
  /** Assembly, material, operation and parameters the engine has computed before. */
  cuts: Array<{ assemblyId: string; materialId: string; operation: Operation; params: RecipeParams }>;
}

async function sample<T extends object>(sql: string, shopId: string): Promise<T[]> {
  return getSequelize().query<T>(sql, { replacements: { shopId }, type: QueryTypes.SELECT });
}

const work: ShopWork[] = [];
for (const shop of data.shops) {
  const recipes = (status: string) =>
    sample<{ id: string; params: RecipeParams }>(
      `SELECT id, params FROM recipes WHERE shop_id = :shopId AND deleted_at IS NULL AND status IN (${status}) ORDER BY md5(id::text) LIMIT 300`,
      shop.id,
    );
  work.push({
    shop,
    approved: (await recipes("'approved'")).map((r) => r.id),
    editable: await recipes("'draft', 'trial'"),
    cuts: (
      await sample<{ assembly_id: string; material_id: string; operation: Operation; params: RecipeParams }>(
        `SELECT DISTINCT ON (assembly_id, material_id, operation) assembly_id, material_id, operation, params FROM recipes WHERE shop_id = :shopId`,
        shop.id,
      )
    ).map((c) => ({ assemblyId: c.assembly_id, materialId: c.material_id, operation: c.operation, params: c.params })),
  });
}
await closeBenchDatabase();

interface Person {
  work: ShopWork;
  cookie: string;
  programmer: boolean;
}

/** Each request: a random signed-in person doing one thing, in the proportions below. */
function mixedPlan(people: Person[]): () => PlannedRequest {
  const random = seededRandom(42);
  const programmers = people.filter((p) => p.programmer);
  let made = 0;
  return () => {
    const r = random();
    // Writes that need a programmer are made by one; everything else by anyone.
    const person = pick(random, r >= 0.75 && r < 0.9 ? programmers : people);
    const { shop } = person.work;
    const base = `/api/shops/${shop.id}`;
    const headers = { cookie: person.cookie };
    if (r < 0.4) {
      const search = new URLSearchParams(listQuery(random, shop)).toString();
      return { kind: "list / search", method: "GET", path: `${base}/recipes${search ? `?${search}` : ""}`, headers };
    }
    if (r < 0.55) return { kind: "read recipe", method: "GET", path: `${base}/recipes/${pick(random, person.work.approved)}`, headers };
    if (r < 0.6) return { kind: "read cut logs", method: "GET", path: `${base}/recipes/${pick(random, person.work.approved)}/cut-logs`, headers };
    if (r < 0.75) {
      const cut = pick(random, person.work.cuts);
      const params = { ...cut.params, axialDepthMm: Number((cut.params.axialDepthMm * (0.5 + random())).toFixed(2)) };
      return { kind: "recommendation", method: "POST", path: `${base}/recommendations`, headers, body: { ...cut, params } };
    }
    if (r < 0.82) {
      const cut = pick(random, person.work.cuts);
      return {
        kind: "create recipe",
        method: "POST",
        path: `${base}/recipes`,
        headers,
        body: { ...cut, name: `${pick(random, PARTS)} ${cut.operation} — job ${9000 + made++}`, notes: "Trial on the second shift." },
      };
    }
    if (r < 0.9) {
      const recipe = pick(random, person.work.editable);
      // Half change the notes, half the depth of cut of the recipe's own parameters (recomputed).
      const body =
        random() < 0.5
          ? { notes: `Checked on ${new Date().toISOString().slice(0, 10)}: clamps moved to the outer slots.`, changeNote: "Notes" }
          : { params: { ...recipe.params, axialDepthMm: Number((0.5 + random() * 3).toFixed(1)) }, changeNote: "Depth of cut" };
      return { kind: "edit recipe", method: "PATCH", path: `${base}/recipes/${recipe.id}`, headers, body };
    }
    const rpm = 8000 + Math.round(random() * 12000);
    return {
      kind: "add cut log",
      method: "POST",
      path: `${base}/recipes/${pick(random, person.work.approved)}/cut-logs`,
      headers,
      body: {
        outcome: pick(random, ["clean", "clean", "clean", "chatter", "poor_finish"]),
        actualRpm: rpm,
        actualFeedMmPerMin: Math.round(rpm * 0.1),
        axialDepthMm: 2,
        radialDepthMm: 0.5,
        note: "Logged from the machine.",
      },
    };
  };
}

const api = await startApi(data.databaseUrl, port);
try {
  // A programmer and an operator of every shop, signed in over HTTP.
  const people: Person[] = [];
  for (const w of work) {
    for (const role of ["programmer", "operator"] as const) {
      const person = w.shop.people.filter((p) => p.role === role).at(-1)!;
      people.push({ work: w, programmer: role === "programmer", cookie: await signIn(api.baseUrl, person.email, BENCH_PASSWORD) });
    }
  }
  console.log(`\n  ${people.length} people of ${work.length} shops signed in; ${CONNECTIONS} connections for ${seconds} s (after a 3 s warm-up)`);
  const plan = mixedPlan(people);
  await runLoad(api.baseUrl, CONNECTIONS, 3, plan);
  const result = await runLoad(api.baseUrl, CONNECTIONS, seconds, plan);
  printLoad("Mixed reads and writes through the API", result);
  const non2xx = [...result.all.statuses].filter(([code]) => code < 200 || code > 299).reduce((t, [, n]) => t + n, 0);
  console.log(`\n  Summary`);
  console.log(`  ${result.requests} requests, ${result.requestsPerSecond.toFixed(1)} requests/s; answers other than 2xx: ${non2xx} (target 0); no answer: ${result.errors}`);
  console.log(`  p50 / p95 / p99 ${[50, 95, 99].map((p) => percentile(result.all.latencies, p).toFixed(1)).join(" / ")} ms`);
  console.log(`  ${machineLine()}`);
} finally {
  await api.stop();
}
