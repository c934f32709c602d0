/**
 * The load benchmarks' database: 20 invented shops with their people, machines, cutters, shop
 * materials and assemblies, and 100 000 recipes spread over them with a year of update times.
 * Everything is invented for the benchmark (no real shop, person, machine or brand).
 *
 * The small library goes in with one multi-row INSERT per table (Sequelize's bulkCreate); a few
 * template recipes are computed by the real engine through the recipe service (so every stored
 * result is one the engine produced for that assembly and material), and the 100 000 recipes,
 * their first revisions and a sample of cut logs are then written by set-based
 * INSERT … SELECT … generate_series statements. Finally VACUUM ANALYZE, as autovacuum would
 * leave the tables in steady state.
 */
import pg from "pg";
import { QueryTypes, type Sequelize } from "sequelize";
import {
  assemblyBodySchema,
  cutterBodySchema,
  machineBodySchema,
  type CutterBody,
  type MachineBody,
  type Operation,
  type Role,
} from "@ringdown/contracts";
import { migrate } from "../src/db/migrate.js";
import { closeDatabase, connectDatabase, getSequelize } from "../src/db/sequelize.js";
import { hashPassword } from "../src/modules/auth/password.js";
import { AssemblyModel } from "../src/modules/assemblies/assembly.model.js";
import { CutterModel } from "../src/modules/cutters/cutter.model.js";
import { MachineModeModel } from "../src/modules/machines/machine-mode.model.js";
import { MachineModel } from "../src/modules/machines/machine.model.js";
import { createRecipe } from "../src/modules/recipes/recipes.service.js";
import { MembershipModel } from "../src/modules/shops/membership.model.js";
import { ShopModel } from "../src/modules/shops/shop.model.js";
import { UserModel } from "../src/modules/users/user.model.js";

export const BENCH_SHOPS = 20;
export const BENCH_RECIPES = 100_000;
export const BENCH_CUT_LOGS = 30_000;
/** Every bench account's password (invented; the bench database is throwaway). */
export const BENCH_PASSWORD = "bench-spindle-warmup-2026";
/** Bumped whenever the data below changes, so a kept database is rebuilt. */
const DATA_VERSION = 5;

const log = (line: string) => console.log(`  ${line}`);

// ---------------------------------------------------------------- the invented scenario

const SHOP_NAMES = [
  "Alderbrook Jig & Fixture", "Brackenridge Panel Works", "Cinderford Model Shop", "Dunmore Sign Co-op",
  "Eastwick Enclosures", "Fallowfield Cabinetry", "Greywater Prototype Lab", "Harrowgate Tooling",
  "Ivel Valley Patterns", "Juniper Lane Joinery", "Kestrel Point Fabrication", "Larkspur Acrylics",
  "Millbeck Plate & Bracket", "Northholm Fixture Plates", "Oxbow Marine Fittings", "Pellworth Display",
  "Quarrymoor Moulds", "Rushcombe Brass", "Saltmarsh Instrument Parts", "Thornbury Workholding",
];
const FIRST_NAMES = ["Agnes", "Bram", "Cordelia", "Desmond", "Elspeth", "Fintan", "Greer", "Hollis", "Ines", "Jory"];
const LAST_NAMES = ["Ashdown", "Barrowcliff", "Carrow", "Dunleavy", "Etheridge", "Fenwright", "Galloway", "Hesketh", "Illing", "Jessop"];
/** Per shop: one owner, two programmers, two operators. */
const SHOP_ROLES: Role[] = ["owner", "programmer", "programmer", "operator", "operator"];

const axis = (drive: "belt" | "ball_screw" | "rack_pinion" | "lead_screw", travelMm: number, maxFeedMmPerMin: number, stiffnessNPerMm: number, movingMassKg: number) => ({
  drive,
  travelMm,
  maxFeedMmPerMin,
  accelerationMmPerS2: 500,
  backlashMm: drive === "ball_screw" ? 0.01 : 0.04,
  movingMassKg,
  stiffnessNPerMm,
});

/** Two invented machines per shop: a steel-framed router and a ball-screw bench mill. */
const MACHINES: MachineBody[] = [
  machineBodySchema.parse({
    name: "Router — steel gantry",
    kind: "gantry_router",
    spindle: { minRpm: 6000, maxRpm: 24000, powerW: 2200, powerCurve: [], dialSettings: [] },
    axes: { x: axis("rack_pinion", 2500, 15000, 900, 45), y: axis("ball_screw", 1300, 15000, 1100, 22), z: axis("ball_screw", 180, 5000, 2500, 9) },
    modes: [
      { direction: "x", frequencyHz: 41, dampingRatio: 0.04, stiffnessNPerMm: 1400, source: "measured", note: "Gantry on its racks; tap test at mid-table" },
      { direction: "y", frequencyHz: 620, dampingRatio: 0.03, stiffnessNPerMm: 2100, source: "measured", note: "Spindle and 6 mm tool at 20 mm stick-out" },
    ],
    deflectionCeilingMm: 0.04,
    avoidBands: [],
    modeMarginPct: 10,
    estimatedFields: ["axes.x.movingMassKg"],
    notes: "Sheet goods, plastics and aluminium plate on the vacuum table.",
  }),
  machineBodySchema.parse({
    name: "Mill — ball-screw bench mill",
    kind: "bench_mill",
    spindle: { minRpm: 200, maxRpm: 8000, powerW: 1500, powerCurve: [], dialSettings: [] },
    axes: { x: axis("ball_screw", 450, 3000, 6000, 35), y: axis("ball_screw", 200, 3000, 4200, 40), z: axis("ball_screw", 300, 2000, 8000, 20) },
    modes: [{ direction: "x", frequencyHz: 470, dampingRatio: 0.04, stiffnessNPerMm: 9500, source: "measured", note: "Head on the column; tap test on a gauge pin" }],
    deflectionCeilingMm: 0.02,
    avoidBands: [],
    modeMarginPct: 10,
    estimatedFields: [],
    notes: "Aluminium and brass fixture parts.",
  }),
];

const cutterBody = (body: Partial<CutterBody>): CutterBody =>
  cutterBodySchema.parse({ maker: "house stock", maxRpm: null, helixDeg: 30, cornerRadiusMm: 0, toolMaterial: "carbide", notes: "", ...body });

const CUTTERS: CutterBody[] = [
  cutterBody({ name: "6 mm flat, 2-flute carbide", shape: "flat", diameterMm: 6, flutes: 2, fluteLengthMm: 22, overallLengthMm: 60, shankDiameterMm: 6, maxRpm: 30000 }),
  cutterBody({ name: "1/4 in compression, 2-flute", shape: "compression", diameterMm: 6.35, flutes: 2, fluteLengthMm: 22.2, overallLengthMm: 63.5, shankDiameterMm: 6.35, helixDeg: 20, maxRpm: 24000 }),
  cutterBody({ name: "3 mm single-flute up-cut", shape: "up_spiral", diameterMm: 3, flutes: 1, fluteLengthMm: 12, overallLengthMm: 38, shankDiameterMm: 3, maxRpm: 30000 }),
  cutterBody({ name: "8 mm flat, 3-flute carbide for aluminium", shape: "flat", diameterMm: 8, flutes: 3, fluteLengthMm: 20, overallLengthMm: 63, shankDiameterMm: 8, helixDeg: 45, maxRpm: 20000 }),
  cutterBody({ name: "6 mm ball nose, 2-flute", shape: "ball", diameterMm: 6, flutes: 2, fluteLengthMm: 18, overallLengthMm: 60, shankDiameterMm: 6, cornerRadiusMm: 3, maxRpm: 30000 }),
];

/** Machine index, cutter index, holder, stick-out [mm], runout [mm]. */
const ASSEMBLIES: Array<[number, number, string, number, number]> = [
  [0, 0, "ER20 collet, 6 mm", 20, 0.01],
  [0, 1, "ER20 collet, 1/4 in", 25, 0.015],
  [0, 2, "ER20 collet, 3 mm", 14, 0.01],
  [1, 3, "ER25 collet chuck, 8 mm", 22, 0.006],
  [1, 4, "ER25 collet chuck, 6 mm", 20, 0.008],
];

/** Global library materials the recipes use, by the assembly they suit. */
const MATERIAL_KEYS_BY_MACHINE: Record<number, string[]> = {
  0: ["mdf", "plywood-birch", "acrylic-cast", "hdpe", "al-6061-t6"],
  1: ["al-6061-t6", "al-5083", "brass-free-cutting", "acetal"],
};

/** Operation and depths of the template recipes, per assembly. */
const CUTS: Array<{ operation: Operation; axialDepthMm: number; radialDepthMm: number }> = [
  { operation: "slot", axialDepthMm: 1.5, radialDepthMm: 1 },
  { operation: "profile", axialDepthMm: 4, radialDepthMm: 0.8 },
  { operation: "pocket", axialDepthMm: 2, radialDepthMm: 0.5 },
  { operation: "finish", axialDepthMm: 6, radialDepthMm: 0.2 },
];

export const PARTS = [
  "Fixture plate", "Sign blank", "Drawer front", "Mounting bracket", "Enclosure lid", "Jig base", "Motor mount",
  "Spoilboard surfacing", "Cable tray cover", "Display plinth", "Gasket plate", "Letter set", "Bearing cap",
  "Clamp jaw", "Hinge block", "Nameplate", "Vacuum pod", "Side rail", "Spacer", "Front panel",
];
const NOTES = [
  "",
  "Air blast on; chips pack in the slot without it.",
  "Clamp the sheet corners; vacuum zones 1 to 3 only.",
  "Check runout before the finishing pass.",
  "Onion-skin 0.3 mm and break the tabs by hand.",
  "Mist coolant, light film. Deburr the top edge.",
  "Climb on the last pass for the finish the customer wants.",
  "Ran clean on the second shift; no chatter at this stick-out.",
  "",
  "Tape and glue hold-down for the small letters.",
];

// ---------------------------------------------------------------- database

export interface BenchShop {
  id: string;
  name: string;
  people: Array<{ id: string; email: string; role: Role }>;
  machineIds: string[];
  cutterIds: string[];
  assemblyIds: string[];
  materialIds: string[];
}

export interface BenchData {
  databaseUrl: string;
  shops: BenchShop[];
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;

function databaseName(databaseUrl: string): string {
  const name = decodeURIComponent(new URL(databaseUrl).pathname.replace(/^\//, ""));
  // Only the benchmark's own databases are ever dropped.
  if (!/^ringdown_bench/.test(name)) throw new Error(`Refusing to use "${name}" for the benchmark: its database name must start with ringdown_bench`);
  return name;
}

async function maintenance<T>(databaseUrl: string, work: (client: pg.Client) => Promise<T>): Promise<T> {
  const url = new URL(databaseUrl);
  url.pathname = "/postgres";
  const client = new pg.Client({ connectionString: url.toString() });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** The bench URL: RINGDOWN_BENCH_DATABASE_URL, or ringdown_bench on the test cluster. */
export function benchDatabaseUrl(): string {
  if (process.env.RINGDOWN_BENCH_DATABASE_URL) return process.env.RINGDOWN_BENCH_DATABASE_URL;
  return `postgres://postgres@127.0.0.1:${process.env.RINGDOWN_PG_TEST_PORT ?? "5434"}/ringdown_bench`;
}

async function readyVersion(databaseUrl: string): Promise<number | null> {
  const name = databaseName(databaseUrl);
  const exists = await maintenance(databaseUrl, async (c) => (await c.query("SELECT 1 FROM pg_database WHERE datname = $1", [name])).rowCount);
  if (!exists) return null;
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const row = await client.query("SELECT version FROM bench_data_ready").catch(() => null);
    return row?.rows[0]?.version ?? null;
  } finally {
    await client.end();
  }
}

/** The shops, people and library of a prepared bench database. */
async function readBenchData(databaseUrl: string): Promise<BenchData> {
  const sequelize = getSequelize();
  const select = <T extends object>(sql: string) => sequelize.query<T>(sql, { type: QueryTypes.SELECT });
  const shops = await select<{ id: string; name: string }>(`SELECT s.id, s.name FROM shops s JOIN bench_shops b ON b.shop_id = s.id ORDER BY b.idx`);
  const people = await select<{ shop_id: string; id: string; email: string; role: Role }>(
    `SELECT m.shop_id, u.id, u.email, m.role FROM memberships m JOIN users u ON u.id = m.user_id ORDER BY u.email`,
  );
  const ids = async (table: string) =>
    select<{ shop_id: string; id: string }>(`SELECT shop_id, id FROM ${table} WHERE shop_id IS NOT NULL ORDER BY name, id`);
  const [machines, cutters] = await Promise.all([ids("machines"), ids("cutters")]);
  const assemblies = await select<{ shop_id: string; id: string }>(`SELECT shop_id, id FROM assemblies ORDER BY holder, id`);
  const keys = [...new Set(Object.values(MATERIAL_KEYS_BY_MACHINE).flat())];
  const materials = await select<{ id: string }>(`SELECT id FROM materials WHERE global_key IN (${keys.map((k) => `'${k}'`).join(", ")})`);
  const of = (rows: Array<{ shop_id: string; id: string }>, shopId: string) => rows.filter((r) => r.shop_id === shopId).map((r) => r.id);
  return {
    databaseUrl,
    shops: shops.map((s) => ({
      id: s.id,
      name: s.name,
      people: people.filter((p) => p.shop_id === s.id).map(({ id, email, role }) => ({ id, email, role })),
      machineIds: of(machines, s.id),
      cutterIds: of(cutters, s.id),
      assemblyIds: of(assemblies, s.id),
      materialIds: materials.map((m) => m.id),
    })),
  };
}

/**
 * Connects this process's Sequelize to the bench database, creating and filling it first unless it
 * already holds this version of the data (pass `fresh` to rebuild it anyway).
 */
export async function prepareBenchDatabase(options: { fresh?: boolean } = {}): Promise<BenchData> {
  const databaseUrl = benchDatabaseUrl();
  const name = databaseName(databaseUrl);
  const ready = options.fresh ? null : await readyVersion(databaseUrl);
  if (ready === DATA_VERSION) {
    log(`reusing the bench database ${name} (delete it or set RINGDOWN_BENCH_FRESH=1 to rebuild)`);
    const applied = await migrate(connectDatabase(databaseUrl), databaseUrl);
    if (applied.length) log(`applied migrations: ${applied.join(", ")}`);
    return readBenchData(databaseUrl);
  }
  const t0 = performance.now();
  await maintenance(databaseUrl, async (c) => {
    await c.query(`DROP DATABASE IF EXISTS ${quoteIdent(name)} WITH (FORCE)`);
    await c.query(`CREATE DATABASE ${quoteIdent(name)} ENCODING 'UTF8' TEMPLATE template0`);
  });
  const sequelize = connectDatabase(databaseUrl);
  await migrate(sequelize, databaseUrl);
  log(`created and migrated ${name} (${((performance.now() - t0) / 1000).toFixed(1)} s)`);
  const t1 = performance.now();
  await insertLibrary(sequelize);
  await insertRecipes(sequelize);
  log(`inserted ${BENCH_RECIPES.toLocaleString("en")} recipes, their revisions and ${BENCH_CUT_LOGS.toLocaleString("en")} cut logs (${((performance.now() - t1) / 1000).toFixed(1)} s)`);
  const t2 = performance.now();
  await sequelize.query("VACUUM ANALYZE");
  log(`VACUUM ANALYZE (${((performance.now() - t2) / 1000).toFixed(1)} s)`);
  await sequelize.query(`CREATE TABLE bench_data_ready (version integer NOT NULL); INSERT INTO bench_data_ready VALUES (${DATA_VERSION});`);
  return readBenchData(databaseUrl);
}

async function insertLibrary(sequelize: Sequelize): Promise<void> {
  const hash = await hashPassword(BENCH_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    const shops = await ShopModel.bulkCreate(SHOP_NAMES.slice(0, BENCH_SHOPS).map((name) => ({ name })), { transaction, returning: true });
    await sequelize.query(`CREATE TABLE bench_shops (idx integer PRIMARY KEY, shop_id uuid NOT NULL)`, { transaction });
    await sequelize.query(`INSERT INTO bench_shops VALUES ${shops.map((s, i) => `(${i}, '${s.id}')`).join(", ")}`, { transaction });
    // Team plan, paid for, so programmers can write.
    await sequelize.query(
      `INSERT INTO shop_subscriptions (shop_id, status, seats, current_period_end) SELECT shop_id, 'active', 10, now() + interval '20 days' FROM bench_shops`,
      { transaction },
    );

    const people = shops.flatMap((shop, s) =>
      SHOP_ROLES.map((role, k) => {
        const first = FIRST_NAMES[(s + k) % FIRST_NAMES.length]!;
        const last = LAST_NAMES[(s * 3 + k) % LAST_NAMES.length]!;
        return { shop, role, name: `${first} ${last}`, email: `${first}.${last}.${s}-${k}@bench.example`.toLowerCase() };
      }),
    );
    const users = await UserModel.bulkCreate(
      people.map((p) => ({ email: p.email, name: p.name, passwordHash: hash, unitSystem: "metric" as const, activeShopId: p.shop.id })),
      { transaction, returning: true },
    );
    await MembershipModel.bulkCreate(
      people.map((p, i) => ({ shopId: p.shop.id, userId: users[i]!.id, role: p.role })),
      { transaction },
    );

    const machines = await MachineModel.bulkCreate(
      shops.flatMap((shop) => MACHINES.map(({ modes: _modes, ...columns }) => ({ shopId: shop.id, ...columns }))),
      { transaction, returning: true },
    );
    await MachineModeModel.bulkCreate(
      machines.flatMap((m, i) => MACHINES[i % MACHINES.length]!.modes.map((mode) => ({ ...mode, shopId: m.shopId, machineId: m.id }))),
      { transaction },
    );
    const cutters = await CutterModel.bulkCreate(
      shops.flatMap((shop) => CUTTERS.map((body) => ({ shopId: shop.id, status: "approved" as const, ...body }))),
      { transaction, returning: true },
    );
    await AssemblyModel.bulkCreate(
      shops.flatMap((shop, s) =>
        ASSEMBLIES.map(([mi, ci, holder, stickoutMm, runoutMm]) => ({
          shopId: shop.id,
          ...assemblyBodySchema.parse({
            machineId: machines[s * MACHINES.length + mi]!.id,
            cutterId: cutters[s * CUTTERS.length + ci]!.id,
            holder,
            stickoutMm,
            runoutMm,
          }),
        })),
      ),
      { transaction },
    );
    // One shop material each, copied from the global birch plywood with the shop's own name and note.
    const [copied] = await sequelize.query(
      `INSERT INTO materials (shop_id, copied_from_id, name, material_group, hardness, cutting_speed, chip_load, kc11_n_per_mm2, mc,
                              unit_power_j_per_mm3, min_chip_thickness_mm, source_note)
       SELECT b.shop_id, m.id, 'Birch plywood, 18 mm (our supplier)', m.material_group, m.hardness, m.cutting_speed, m.chip_load,
              m.kc11_n_per_mm2, m.mc, m.unit_power_j_per_mm3, m.min_chip_thickness_mm, 'Copied from the global “' || m.name || '”. ' || m.source_note
         FROM materials m CROSS JOIN bench_shops b WHERE m.global_key = 'plywood-birch'
       RETURNING id`,
      { transaction, type: QueryTypes.SELECT },
    );
    if (!copied) throw new Error("the global material library has no plywood-birch row");
  });
}

async function insertRecipes(sequelize: Sequelize): Promise<void> {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  // Template recipes in the first shop, computed by the engine through the recipe service.
  const [first] = await select<{ shop_id: string }>(`SELECT shop_id FROM bench_shops WHERE idx = 0`);
  const shopId = first!.shop_id;
  const [author] = await select<{ user_id: string; name: string }>(
    `SELECT m.user_id, u.name FROM memberships m JOIN users u ON u.id = m.user_id WHERE m.shop_id = :shopId AND m.role = 'programmer' LIMIT 1`,
    { shopId },
  );
  const assemblies = await select<{ id: string; machine_name: string; diameter_mm: number }>(
    `SELECT a.id, m.name AS machine_name, c.diameter_mm FROM assemblies a JOIN machines m ON m.id = a.machine_id JOIN cutters c ON c.id = a.cutter_id
      WHERE a.shop_id = :shopId ORDER BY a.holder`,
    { shopId },
  );
  const materials = await select<{ id: string; global_key: string }>(`SELECT id, global_key FROM materials WHERE global_key IS NOT NULL`);
  const machineIndex = (name: string) => MACHINES.findIndex((m) => m.name === name);
  const t0 = performance.now();
  let templates = 0;
  for (const a of assemblies) {
    for (const key of MATERIAL_KEYS_BY_MACHINE[machineIndex(a.machine_name)] ?? []) {
      const material = materials.find((m) => m.global_key === key);
      if (!material) throw new Error(`the global material library has no ${key} row`);
      for (const cut of CUTS) {
        await createRecipe(
          shopId,
          {
            name: `Template ${templates}`,
            assemblyId: a.id,
            materialId: material.id,
            operation: cut.operation,
            params: {
              axialDepthMm: cut.axialDepthMm,
              // A slot is as wide as the cutter.
              radialDepthMm: cut.operation === "slot" ? a.diameter_mm : cut.radialDepthMm,
              workPositionXMm: 0,
              workPositionYMm: 0,
              workRegion: null,
              millingDirection: "climb",
              rpmOverride: null,
              chipLoadOverrideMm: null,
            },
            notes: "",
          },
          { userId: author!.user_id, role: "programmer", name: author!.name, ip: null },
        );
        templates++;
      }
    }
  }
  log(`computed ${templates} template recipes with the engine (${((performance.now() - t0) / 1000).toFixed(1)} s)`);

  // The same template in every shop: the shop's assembly, machine and cutter in the same position.
  await sequelize.query(`
    CREATE TABLE bench_templates AS
      SELECT row_number() OVER (ORDER BY r.created_at, r.id) - 1 AS idx, a_pos.pos AS assembly_pos, r.material_id,
             r.operation, r.params, r.result, r.rpm, r.feed_mm_per_min
        FROM recipes r
        JOIN (SELECT id, row_number() OVER (ORDER BY holder) - 1 AS pos FROM assemblies WHERE shop_id = '${shopId}') a_pos ON a_pos.id = r.assembly_id;
    CREATE TABLE bench_assemblies AS
      SELECT b.idx AS shop_idx, row_number() OVER (PARTITION BY a.shop_id ORDER BY a.holder) - 1 AS pos, a.id, a.machine_id, a.cutter_id
        FROM assemblies a JOIN bench_shops b ON b.shop_id = a.shop_id;
    CREATE TABLE bench_authors AS
      SELECT b.idx AS shop_idx, row_number() OVER (PARTITION BY m.shop_id ORDER BY m.user_id) - 1 AS pos, m.user_id
        FROM memberships m JOIN bench_shops b ON b.shop_id = m.shop_id WHERE m.role IN ('owner', 'programmer');
    DELETE FROM recipes;
  `);
  const [{ n }] = (await select<{ n: number }>(`SELECT count(*)::int AS n FROM bench_templates`)) as [{ n: number }];

  await withSecondaryIndexesRebuilt(sequelize, ["recipes", "recipe_revisions", "cut_logs"], () => bulkRecipes(sequelize, n));
  await sequelize.query(`DROP TABLE bench_templates, bench_assemblies, bench_authors`);
}

/**
 * Runs a bulk load with the tables' secondary indexes dropped and then recreated from their own
 * definitions (pg_indexes), the usual way to bulk-load PostgreSQL: building a trigram index once
 * takes seconds, maintaining it row by row during a 100 000-row INSERT takes minutes. Indexes that
 * back a constraint (primary keys, unique constraints) stay.
 */
async function withSecondaryIndexesRebuilt(sequelize: Sequelize, tables: string[], work: () => Promise<void>): Promise<void> {
  const indexes = await sequelize.query<{ name: string; definition: string }>(
    `SELECT c.relname AS name, pg_get_indexdef(i.indexrelid) AS definition
       FROM pg_index i JOIN pg_class c ON c.oid = i.indexrelid JOIN pg_class t ON t.oid = i.indrelid
      WHERE t.relname IN (:tables) AND t.relnamespace = 'public'::regnamespace
        AND NOT EXISTS (SELECT 1 FROM pg_constraint k WHERE k.conindid = i.indexrelid)`,
    { replacements: { tables }, type: QueryTypes.SELECT },
  );
  await sequelize.query(indexes.map((ix) => `DROP INDEX ${quoteIdent(ix.name)};`).join("\n"));
  await work();
  for (const ix of indexes) await sequelize.query(ix.definition);
}

async function bulkRecipes(sequelize: Sequelize, n: number): Promise<void> {
  // 100 000 recipes: shop g % 20; within the shop (k = g / 20) template k % n, a part name and job
  // number, a status (more approved than retired), notes from a short list, updated within the
  // last year.
  await sequelize.query(
    `INSERT INTO recipes (shop_id, name, assembly_id, machine_id, cutter_id, material_id, operation, status, params, result,
                          rpm, feed_mm_per_min, notes, author_id, created_at, updated_at)
     SELECT b.shop_id,
            parts.a[1 + (g / :shops * 7) % array_length(parts.a, 1)] || ' ' || t.operation || ' — job ' || (1000 + g / :shops),
            ba.id, ba.machine_id, ba.cutter_id, t.material_id, t.operation,
            (ARRAY['draft','trial','proven','approved','approved','approved','retired'])[1 + (g / :shops * 13) % 7],
            t.params, t.result, t.rpm, t.feed_mm_per_min,
            notes.a[1 + (g / :shops * 11) % array_length(notes.a, 1)],
            au.user_id,
            now() - interval '366 days' + (g * 317 % 525600 || ' minutes')::interval,
            now() - ((g * 7919) % 525600 || ' minutes')::interval
       FROM generate_series(0, :count - 1) AS g
       JOIN bench_shops b ON b.idx = g % :shops
       JOIN bench_templates t ON t.idx = (g / :shops) % :templates
       JOIN bench_assemblies ba ON ba.shop_idx = b.idx AND ba.pos = t.assembly_pos
       JOIN bench_authors au ON au.shop_idx = b.idx AND au.pos = (g / :shops) % 3
      CROSS JOIN (SELECT ARRAY[:parts]::text[] AS a) parts
      CROSS JOIN (SELECT ARRAY[:notes]::text[] AS a) notes`,
    { replacements: { count: BENCH_RECIPES, shops: BENCH_SHOPS, templates: n, parts: PARTS, notes: NOTES } },
  );
  // created_at must not be after updated_at.
  await sequelize.query(`UPDATE recipes SET created_at = updated_at WHERE created_at > updated_at`);
  await sequelize.query(
    `INSERT INTO recipe_revisions (shop_id, recipe_id, revision, name, assembly_id, material_id, operation, params, result, notes, change_note, author_id, created_at)
     SELECT shop_id, id, 1, name, assembly_id, material_id, operation, params, result, notes, 'Created', author_id, created_at FROM recipes`,
  );
  // Cut logs on a sample of the proven and approved recipes.
  await sequelize.query(
    `INSERT INTO cut_logs (shop_id, recipe_id, recipe_revision, machine_id, material_id, user_id, outcome, actual_rpm,
                           actual_feed_mm_per_min, axial_depth_mm, radial_depth_mm, note, created_at)
     SELECT r.shop_id, r.id, 1, r.machine_id, r.material_id, r.author_id,
            (ARRAY['clean','clean','clean','chatter','poor_finish','feed_override'])[1 + k % 6],
            r.rpm, r.feed_mm_per_min, (r.params->>'axialDepthMm')::float8, (r.params->>'radialDepthMm')::float8,
            CASE WHEN k % 6 = 3 THEN 'Chatter on the long side; dropped the speed a step.' ELSE '' END, r.updated_at
       FROM (SELECT r.*, row_number() OVER (ORDER BY r.id) AS k FROM recipes r WHERE r.status IN ('proven', 'approved')) r
      WHERE k <= :count`,
    { replacements: { count: BENCH_CUT_LOGS } },
  );
}

export async function closeBenchDatabase(): Promise<void> {
  await closeDatabase();
}
