/**
 * Demo recipes (all invented): a few weeks of Quillfeather Fixture Works' life on its two machines
 * and a little of Ostrander Sign & Panel's. Each recipe is computed by the engine from the demo
 * library exactly as the server computes it, then walks its own story (edits as revisions, status
 * changes by the people whose role allows them, cut-log entries from the floor) with timestamps in
 * the past, so a newcomer sees recipes in every state with their history and evidence.
 * Idempotent: every recipe has a fixed id and is created with its story only when missing, so edits
 * made through the app survive a restart. Runs after the library seed.
 */
import { QueryTypes } from "sequelize";
import { recipeParamsSchema, type CutOutcome, type Operation, type RecipeParams, type RecipeStatus } from "@ringdown/contracts";
import { getSequelize, inTransaction, type Tx } from "../db/sequelize.js";
import { computePlan } from "../modules/recommendations/recommendations.service.js";
import { demoAssemblyIds, demoMaterialIds, demoShopIds, demoUserIds } from "./demo-ids.js";

/** Fixed ids of the demo recipes. */
export const demoRecipeIds = {
  plyProfile: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c01",
  mdfPocket: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c02",
  acrylicEdge: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c03",
  aluSlotHeron: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c04",
  veeLettering: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c05",
  smallHolesAdapter: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c06",
  walnutRelief: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c07",
  fixturePlateAdaptive: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c08",
  brassTabs: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c09",
  aluHoles: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c10",
  steelKeyway: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c11",
  aluSlotWren: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c12",
  signLetters: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c21",
  foamCutout: "b5e1c9a2-2d4f-4a8b-9c63-7e1f0a2b4c22",
} as const;

const Q = demoShopIds.quillfeather;
const O = demoShopIds.ostrander;
const { maren, imke, teodor, sunniva, callum, halvard } = demoUserIds;

type Material = { shop: string } | { global: string };
type Event =
  | { at: number; by: string; revise: Partial<RecipeParams> & { name?: string; notes?: string; assemblyId?: string }; note: string }
  | { at: number; by: string; to: RecipeStatus; comment?: string }
  | { at: number; by: string; log: CutOutcome; note: string; rpm?: number; feed?: number; overridePct?: number };

interface DemoRecipe {
  id: string;
  shopId: string;
  name: string;
  assemblyId: string;
  material: Material;
  operation: Operation;
  params: Partial<RecipeParams> & { axialDepthMm: number; radialDepthMm: number };
  notes: string;
  authorId: string;
  /** Days before the seed run when the recipe was created. */
  createdDaysAgo: number;
  /** Later events, days before the seed run (smaller = later). */
  story: Event[];
  /** A copy: recipe it was copied from (already seeded) and its revision. */
  copiedFrom?: { id: string; name: string; revision: number; machineName: string };
}

const recipes: DemoRecipe[] = [
  // ---------------------------------------------------------------- Heron (belt router)
  {
    id: demoRecipeIds.plyProfile,
    shopId: Q,
    name: "Birch ply 18 mm — outside profile, compression",
    assemblyId: demoAssemblyIds.heronCompression635,
    material: { shop: demoMaterialIds.quillfeatherBirchPly18 },
    operation: "profile",
    params: { axialDepthMm: 6, radialDepthMm: 3, millingDirection: "climb" },
    notes: "To 18 mm in the passes the planner asks for; tabs 4 mm. Vacuum zones 1 and 2 only.",
    authorId: teodor,
    createdDaysAgo: 41,
    story: [
      { at: 40, by: teodor, to: "trial" },
      { at: 39, by: sunniva, log: "burn_melt", note: "Scorch on the last pass at the corners; dwelling in the tab ramps." },
      { at: 39, by: teodor, revise: { radialDepthMm: 2 }, note: "Lighter stepover so the corners keep moving" },
      { at: 37, by: sunniva, log: "clean", note: "Clean edges both faces, no fuzz." },
      { at: 37, by: teodor, to: "proven" },
      { at: 36, by: imke, to: "approved", comment: "Good for the jig bases. Check the glue line in each new stack." },
      { at: 20, by: sunniva, log: "clean", note: "Batch of 12 jig bases, all clean." },
      { at: 6, by: sunniva, log: "feed_override", note: "Ran at 80 % in the old stack; harder glue line.", overridePct: 80 },
    ],
  },
  {
    id: demoRecipeIds.mdfPocket,
    shopId: Q,
    name: "MDF pocket floors — 1/4 in down-cut",
    assemblyId: demoAssemblyIds.heronDowncut635,
    material: { global: "mdf" },
    operation: "pocket",
    params: { axialDepthMm: 4, radialDepthMm: 2.5 },
    notes: "Drawer-organiser pockets; down-cut keeps the top face clean.",
    authorId: callum,
    createdDaysAgo: 18,
    story: [
      { at: 17, by: callum, to: "trial" },
      { at: 15, by: teodor, log: "clean", note: "Floors flat, top edge crisp." },
      { at: 15, by: callum, to: "proven" },
    ],
  },
  {
    id: demoRecipeIds.acrylicEdge,
    shopId: Q,
    name: "Cast acrylic 6 mm — edge finish",
    assemblyId: demoAssemblyIds.heronFlat6,
    material: { global: "acrylic-cast" },
    operation: "finish",
    params: { axialDepthMm: 6, radialDepthMm: 0.5 },
    notes: "Guard windows. Air blast on; no coolant.",
    authorId: teodor,
    createdDaysAgo: 9,
    story: [
      { at: 8, by: teodor, to: "trial" },
      { at: 7, by: sunniva, log: "burn_melt", note: "Chips welded to the cutter on the second window; edge frosted." },
      { at: 6, by: teodor, revise: { radialDepthMm: 0.8 }, note: "Thicker chip so the heat leaves with it" },
    ],
  },
  {
    id: demoRecipeIds.aluSlotHeron,
    shopId: Q,
    name: "6061 plate 6 mm — cable slot",
    assemblyId: demoAssemblyIds.heronFlat6,
    material: { global: "al-6061-t6" },
    operation: "slot",
    params: { axialDepthMm: 0.5, radialDepthMm: 6, millingDirection: "conventional" },
    notes: "Mist on. Conventional: the belts have backlash.",
    authorId: teodor,
    createdDaysAgo: 30,
    story: [
      { at: 29, by: teodor, to: "trial" },
      { at: 27, by: teodor, log: "clean", note: "Fine near the origin." },
      { at: 27, by: teodor, to: "proven" },
      { at: 25, by: sunniva, log: "chatter", note: "Loud chatter at the far end of X, wavy wall." },
      { at: 24, by: imke, to: "trial", comment: "Chatters at the far end of X. Re-test after the belt tension check." },
    ],
  },
  {
    id: demoRecipeIds.veeLettering,
    shopId: Q,
    name: "Part numbers — 60° V in birch ply",
    assemblyId: demoAssemblyIds.heronVee60,
    material: { shop: demoMaterialIds.quillfeatherBirchPly18 },
    operation: "slot",
    params: { axialDepthMm: 1.5, radialDepthMm: 1.7 },
    notes: "Engraved part numbers on jig bases, 8 mm text.",
    authorId: callum,
    createdDaysAgo: 3,
    story: [],
  },
  {
    id: demoRecipeIds.smallHolesAdapter,
    shopId: Q,
    name: "Oak pegs — 1/8 in up-cut in the sleeve adapter",
    assemblyId: demoAssemblyIds.heronUpcut3175PoorAdapter,
    material: { global: "hardwood-medium" },
    operation: "profile",
    params: { axialDepthMm: 3, radialDepthMm: 0.8 },
    notes: "",
    authorId: teodor,
    createdDaysAgo: 60,
    story: [
      { at: 59, by: teodor, to: "trial" },
      { at: 58, by: sunniva, log: "cutter_broke", note: "Snapped on the second peg. One flute did all the cutting." },
      { at: 57, by: sunniva, log: "cutter_broke", note: "Second cutter gone the same way." },
      { at: 56, by: imke, to: "retired", comment: "The sleeve adapter runs out 0.08 mm and breaks 1/8 in cutters. Use a real 1/8 in collet." },
    ],
  },
  {
    id: demoRecipeIds.walnutRelief,
    shopId: Q,
    name: "Walnut tray — ball-nose finish",
    assemblyId: demoAssemblyIds.heronBall6,
    material: { global: "hardwood-medium" },
    operation: "finish",
    params: { axialDepthMm: 1, radialDepthMm: 0.6 },
    notes: "Scallop about 0.015 mm at this stepover.",
    authorId: teodor,
    createdDaysAgo: 2,
    story: [],
  },
  // ---------------------------------------------------------------- Wren (bench mill)
  {
    id: demoRecipeIds.fixturePlateAdaptive,
    shopId: Q,
    name: "Fixture plate 6061 — adaptive pocket, 8 mm 3F",
    assemblyId: demoAssemblyIds.wrenFlat8Alu,
    material: { global: "al-6061-t6" },
    operation: "adaptive",
    params: { axialDepthMm: 8, radialDepthMm: 0.8 },
    notes: "Light stepover, stepping down in the passes the deflection ceiling allows. Mist.",
    authorId: teodor,
    createdDaysAgo: 33,
    story: [
      { at: 32, by: teodor, to: "trial" },
      { at: 31, by: teodor, log: "clean", note: "Quiet, chips silver, no built-up edge." },
      { at: 31, by: teodor, to: "proven" },
      { at: 30, by: maren, to: "approved", comment: "Our standard for fixture plates." },
      { at: 12, by: sunniva, log: "clean", note: "Four plates, no trouble." },
    ],
  },
  {
    id: demoRecipeIds.brassTabs,
    shopId: Q,
    name: "Brass locating tabs — profile, 6 mm HSS",
    assemblyId: demoAssemblyIds.wrenFlat6Hss,
    material: { global: "brass-free-cutting" },
    operation: "profile",
    params: { axialDepthMm: 3, radialDepthMm: 1 },
    notes: "Deburr by hand afterwards.",
    authorId: callum,
    createdDaysAgo: 11,
    story: [
      { at: 10, by: callum, to: "trial" },
      { at: 9, by: sunniva, log: "poor_finish", note: "Burr on the exit side, walls fine." },
      { at: 9, by: callum, revise: { millingDirection: "climb" }, note: "Climb to push the burr to the waste side" },
      { at: 8, by: sunniva, log: "clean", note: "Burr much smaller, walls bright." },
      { at: 8, by: callum, to: "proven" },
    ],
  },
  {
    id: demoRecipeIds.aluHoles,
    shopId: Q,
    name: "5 mm holes in 6061 — jobber drill",
    assemblyId: demoAssemblyIds.wrenDrill5,
    material: { global: "al-6061-t6" },
    operation: "drill",
    params: { axialDepthMm: 12, radialDepthMm: 5 },
    notes: "Peck every 5 mm. Spot first.",
    authorId: teodor,
    createdDaysAgo: 45,
    story: [
      { at: 44, by: teodor, to: "trial" },
      { at: 44, by: teodor, log: "clean", note: "Holes on size with a pin gauge." },
      { at: 43, by: teodor, to: "proven" },
      { at: 43, by: imke, to: "approved" },
      { at: 5, by: sunniva, log: "clean", note: "48 holes, one chip pack-up cleared with a peck." },
    ],
  },
  {
    id: demoRecipeIds.steelKeyway,
    shopId: Q,
    name: "S235 keyway — 6 mm HSS slot",
    assemblyId: demoAssemblyIds.wrenFlat6Hss,
    material: { global: "steel-s235" },
    operation: "slot",
    params: { axialDepthMm: 1, radialDepthMm: 6 },
    notes: "Flood coolant. Not tried yet.",
    authorId: teodor,
    createdDaysAgo: 1,
    story: [],
  },
];

/** A copy of the Heron cable slot onto the stiffer Wren mill: recomputed there, not yet proven. */
const copies: DemoRecipe[] = [
  {
    id: demoRecipeIds.aluSlotWren,
    shopId: Q,
    name: "6061 plate 6 mm — cable slot (Wren)",
    assemblyId: demoAssemblyIds.wrenFlat6Hss,
    material: { global: "al-6061-t6" },
    operation: "slot",
    params: { axialDepthMm: 0.5, radialDepthMm: 6, millingDirection: "conventional" },
    notes: "Mist on. Conventional: the belts have backlash.",
    authorId: imke,
    createdDaysAgo: 23,
    story: [],
    copiedFrom: { id: demoRecipeIds.aluSlotHeron, name: "6061 plate 6 mm — cable slot", revision: 1, machineName: "Heron — belt gantry router" },
  },
];

const ostrander: DemoRecipe[] = [
  {
    id: demoRecipeIds.signLetters,
    shopId: O,
    name: "Cast acrylic letters — 90° V",
    assemblyId: demoAssemblyIds.ostranderVee90,
    material: { global: "acrylic-cast" },
    operation: "slot",
    params: { axialDepthMm: 2, radialDepthMm: 4 },
    notes: "Inlay lettering for shop-front signs.",
    authorId: callum,
    createdDaysAgo: 21,
    story: [
      { at: 20, by: callum, to: "trial" },
      { at: 19, by: callum, log: "clean", note: "Polished V walls, no melt." },
      { at: 19, by: callum, to: "proven" },
      { at: 18, by: halvard, to: "approved" },
    ],
  },
  {
    id: demoRecipeIds.foamCutout,
    shopId: O,
    name: "PVC foam 10 mm — letter cut-out",
    assemblyId: demoAssemblyIds.ostranderUpcut635,
    material: { global: "pvc-foam" },
    operation: "profile",
    params: { axialDepthMm: 10, radialDepthMm: 3 },
    notes: "",
    authorId: callum,
    createdDaysAgo: 4,
    story: [{ at: 3, by: callum, to: "trial" }],
  },
];

export const demoRecipes: readonly DemoRecipe[] = [...recipes, ...copies, ...ostrander];

async function query<T extends object>(sql: string, replacements: Record<string, unknown>, tx: Tx): Promise<T[]> {
  return getSequelize().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction: tx });
}

async function exec(sql: string, replacements: Record<string, unknown>, tx: Tx): Promise<void> {
  await getSequelize().query(sql, { replacements, transaction: tx });
}

async function materialId(m: Material, tx: Tx): Promise<string> {
  if ("shop" in m) return m.shop;
  const rows = await query<{ id: string }>(`SELECT id FROM materials WHERE global_key = :key`, { key: m.global }, tx);
  if (!rows[0]) throw new Error(`demo recipes need the global material "${m.global}" (loaded by migrate())`);
  return rows[0].id;
}

/** A moment `days` before `now`, at a working hour that differs by event so the order reads naturally. */
const daysAgo = (now: number, days: number, step: number): Date => new Date(now - days * 86_400_000 + (8 + (step % 9)) * 3_600_000);

async function seedOne(r: DemoRecipe, now: number, tx: Tx): Promise<number> {
  const exists = await query(`SELECT 1 FROM recipes WHERE id = :id`, { id: r.id }, tx);
  if (exists.length > 0) return 0;
  let created = 0;
  const material = await materialId(r.material, tx);
  let state = {
    name: r.name,
    assemblyId: r.assemblyId,
    materialId: material,
    operation: r.operation,
    params: recipeParamsSchema.parse(r.params),
    notes: r.notes,
  };
  let plan = await computePlan(r.shopId, state, tx);
  let revision = 1;
  let status: RecipeStatus = "draft";
  let lastComment: string | null = null;
  const createdAt = daysAgo(now, r.createdDaysAgo, 0);
  let updatedAt = createdAt;

  await exec(
    `INSERT INTO recipes (id, shop_id, name, assembly_id, machine_id, cutter_id, material_id, operation, status, revision, params, result, rpm, feed_mm_per_min, notes, author_id, created_at, updated_at)
     VALUES (:id, :shopId, :name, :assemblyId, :machineId, :cutterId, :materialId, :operation, 'draft', 1, :params, :result, :rpm, :feed, :notes, :authorId, :at, :at)`,
    {
      id: r.id,
      shopId: r.shopId,
      ...state,
      machineId: plan.machine.id,
      cutterId: plan.cutter.id,
      params: JSON.stringify(state.params),
      result: JSON.stringify(plan.summary),
      rpm: plan.summary.rpm,
      feed: plan.summary.feedMmPerMin,
      authorId: r.authorId,
      at: createdAt,
    },
    tx,
  );
  const changeNote = r.copiedFrom
    ? `Copied from “${r.copiedFrom.name}” revision ${r.copiedFrom.revision} (${r.copiedFrom.machineName}); recomputed for ${plan.machine.name}, not yet proven there`
    : "Created";
  const writeRevision = async (by: string, note: string, at: Date): Promise<void> => {
    await exec(
      `INSERT INTO recipe_revisions (shop_id, recipe_id, revision, name, assembly_id, material_id, operation, params, result, notes, change_note, author_id, created_at)
       VALUES (:shopId, :recipeId, :revision, :name, :assemblyId, :materialId, :operation, :params, :result, :notes, :note, :by, :at)`,
      { shopId: r.shopId, recipeId: r.id, revision, ...state, params: JSON.stringify(state.params), result: JSON.stringify(plan.summary), note, by, at },
      tx,
    );
    created++;
  };
  await writeRevision(r.authorId, changeNote, createdAt);
  created++;

  let step = 1;
  for (const event of r.story) {
    const at = daysAgo(now, event.at, step++);
    if ("revise" in event) {
      const { name, notes, assemblyId, ...params } = event.revise;
      state = {
        ...state,
        name: name ?? state.name,
        notes: notes ?? state.notes,
        assemblyId: assemblyId ?? state.assemblyId,
        params: recipeParamsSchema.parse({ ...state.params, ...params }),
      };
      plan = await computePlan(r.shopId, state, tx);
      revision += 1;
      await writeRevision(event.by, event.note, at);
    } else if ("to" in event) {
      if (event.to === "proven") {
        const clean = await query(`SELECT 1 FROM cut_logs WHERE recipe_id = :id AND machine_id = :m AND outcome = 'clean'`, { id: r.id, m: plan.machine.id }, tx);
        if (clean.length === 0) throw new Error(`demo recipe "${r.name}" is marked proven without a clean logged cut`);
      }
      await exec(
        `INSERT INTO recipe_transitions (shop_id, recipe_id, from_status, to_status, comment, actor_id, created_at) VALUES (:shopId, :id, :from, :to, :comment, :by, :at)`,
        { shopId: r.shopId, id: r.id, from: status, to: event.to, comment: event.comment ?? "", by: event.by, at },
        tx,
      );
      status = event.to;
      lastComment = event.comment ?? null;
      created++;
    } else {
      // What the floor ran: the recipe's numbers, or the override they note.
      const override = event.overridePct ?? null;
      await exec(
        `INSERT INTO cut_logs (shop_id, recipe_id, recipe_revision, machine_id, material_id, user_id, outcome, actual_rpm, actual_feed_mm_per_min, axial_depth_mm, radial_depth_mm, feed_override_pct, note, created_at)
         VALUES (:shopId, :id, :revision, :machineId, :materialId, :by, :outcome, :rpm, :feed, :ap, :ae, :override, :note, :at)`,
        {
          shopId: r.shopId,
          id: r.id,
          revision,
          machineId: plan.machine.id,
          materialId: state.materialId,
          by: event.by,
          outcome: event.log,
          rpm: event.rpm ?? plan.summary.rpm,
          feed: event.feed ?? plan.summary.feedMmPerMin * (override ?? 100) / 100,
          ap: plan.summary.axialDepthMm ?? state.params.axialDepthMm,
          ae: plan.summary.radialDepthMm ?? state.params.radialDepthMm,
          override,
          note: event.note,
          at,
        },
        tx,
      );
      created++;
    }
    updatedAt = at;
  }

  await exec(
    `UPDATE recipes SET name = :name, assembly_id = :assemblyId, machine_id = :machineId, cutter_id = :cutterId, operation = :operation,
            params = :params, result = :result, rpm = :rpm, feed_mm_per_min = :feed, notes = :notes, status = :status, revision = :revision,
            last_comment = :lastComment, updated_at = :updatedAt
      WHERE id = :id`,
    {
      id: r.id,
      ...state,
      machineId: plan.machine.id,
      cutterId: plan.cutter.id,
      params: JSON.stringify(state.params),
      result: JSON.stringify(plan.summary),
      rpm: plan.summary.rpm,
      feed: plan.summary.feedMmPerMin,
      status,
      revision,
      lastComment,
      updatedAt,
    },
    tx,
  );
  return created;
}

/** Returns how many records it created (0 on a second run). Runs after the library seed. */
export async function seedRecipes(now: number = Date.now()): Promise<number> {
  return inTransaction(async (tx) => {
    // Serialise concurrent seed runs (several API instances starting at once).
    await exec(`SELECT pg_advisory_xact_lock(72104010)`, {}, tx);
    let created = 0;
    for (const r of demoRecipes) created += await seedOne(r, now, tx);
    return created;
  });
}
