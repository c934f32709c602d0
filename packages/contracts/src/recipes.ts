import { z } from "zod";
import { unitSystems } from "./library.js";
import { pageOf, paginationQuerySchema } from "./pagination.js";

const uuid = z.string().uuid();
const num = (what: string, min: number, max: number) =>
  z.number({ error: `Enter ${what}` }).finite(`Enter ${what}`).min(min, `${what} must be at least ${min}`).max(max, `${what} must be at most ${max}`);
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters`);

export const operations = ["slot", "profile", "adaptive", "pocket", "finish", "drill", "ramp"] as const;
export const operationSchema = z.enum(operations);
export type Operation = z.infer<typeof operationSchema>;

export const recipeStatuses = ["draft", "trial", "proven", "approved", "retired"] as const;
export const recipeStatusSchema = z.enum(recipeStatuses);
export type RecipeStatus = z.infer<typeof recipeStatusSchema>;

/** A rectangle of work positions [mm]. */
export const workRegionSchema = z
  .object({
    xMinMm: num("region X from", 0, 20000),
    xMaxMm: num("region X to", 0, 20000),
    yMinMm: num("region Y from", 0, 20000),
    yMaxMm: num("region Y to", 0, 20000),
  })
  .superRefine((r, ctx) => {
    if (r.xMaxMm < r.xMinMm) ctx.addIssue({ code: "custom", path: ["xMaxMm"], message: "Region X to must not be less than X from" });
    if (r.yMaxMm < r.yMinMm) ctx.addIssue({ code: "custom", path: ["yMaxMm"], message: "Region Y to must not be less than Y from" });
  });
export type WorkRegion = z.infer<typeof workRegionSchema>;

/** What the programmer chooses; the engine computes the rest. */
export const recipeParamsSchema = z.object({
  axialDepthMm: num("axial depth", 0.001, 200),
  radialDepthMm: num("radial depth", 0.001, 200),
  workPositionXMm: num("work position X", 0, 20000).default(0),
  workPositionYMm: num("work position Y", 0, 20000).default(0),
  /** Where the cut moves over the table [mm]: when marked, the machine's stiffness is the worst
   *  case of its measured map over this rectangle instead of the value at the work position. */
  workRegion: workRegionSchema.nullable().default(null),
  millingDirection: z.enum(["climb", "conventional"]).default("climb"),
  /** Optional programmer choices; the engine still clamps them to every ceiling. */
  rpmOverride: num("spindle speed", 1, 200000).nullable().default(null),
  chipLoadOverrideMm: num("chip load", 0.0005, 2).nullable().default(null),
});
export type RecipeParams = z.infer<typeof recipeParamsSchema>;

/** The headline numbers stored with each revision (recomputed by the server). */
export const recipeResultSummarySchema = z.object({
  rpm: z.number(),
  feedMmPerMin: z.number(),
  chipLoadMm: z.number(),
  materialRemovalRateMm3PerMin: z.number(),
  powerW: z.number(),
  totalDeflectionMm: z.number(),
  /** Depths the engine used [mm]: may be less than asked (then take more passes). Absent in results saved before they were stored. */
  axialDepthMm: z.number().optional(),
  radialDepthMm: z.number().optional(),
  bindingLimit: z.string().nullable(),
  stable: z.boolean().nullable(),
  warnings: z.array(z.string()),
});
export type RecipeResultSummary = z.infer<typeof recipeResultSummarySchema>;

export const recipeBodySchema = z.object({
  name: text(160).min(1, "Name the recipe"),
  assemblyId: uuid,
  materialId: uuid,
  operation: operationSchema,
  params: recipeParamsSchema,
  notes: text(4000).default(""),
});
export type RecipeBody = z.infer<typeof recipeBodySchema>;

/** PATCH: only the fields sent change (no defaults fill in missing ones); `params`, when sent, is the whole set. */
export const recipeUpdateBodySchema = z.object({
  name: text(160).min(1, "Name the recipe").optional(),
  assemblyId: uuid.optional(),
  materialId: uuid.optional(),
  operation: operationSchema.optional(),
  params: recipeParamsSchema.optional(),
  notes: text(4000).optional(),
  changeNote: text(500).default(""),
});
export type RecipeUpdateBody = z.infer<typeof recipeUpdateBodySchema>;

export const recipeSchema = z.object({
  id: uuid,
  shopId: uuid,
  name: z.string(),
  assemblyId: uuid,
  machineId: uuid,
  cutterId: uuid,
  materialId: uuid,
  operation: operationSchema,
  status: recipeStatusSchema,
  revision: z.number().int().min(1),
  params: recipeParamsSchema,
  result: recipeResultSummarySchema,
  notes: z.string(),
  needsRecheck: z.boolean(),
  authorId: uuid,
  authorName: z.string(),
  machineName: z.string(),
  cutterName: z.string(),
  materialName: z.string(),
  lastComment: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** Set while the recipe is in the shop's bin (restore with POST recipes/:id/restore-deleted). */
  deletedAt: z.string().nullable().default(null),
  /** Number of cut-log entries for this recipe, on any machine. */
  cutLogCount: z.number().int().min(0).default(0),
});
export type Recipe = z.infer<typeof recipeSchema>;
/**
 * A recipe as the list shows it: no parameters and, of the results, the headline numbers only (the
 * warnings and limits are on the recipe itself, GET recipes/:id). Keeps a page of 50 small.
 */
export const recipeListItemSchema = recipeSchema.omit({ params: true, result: true }).extend({
  result: recipeResultSummarySchema.pick({
    rpm: true,
    feedMmPerMin: true,
    chipLoadMm: true,
    materialRemovalRateMm3PerMin: true,
    powerW: true,
    stable: true,
  }),
});
export type RecipeListItem = z.infer<typeof recipeListItemSchema>;
export const recipePageSchema = pageOf(recipeListItemSchema);
export type RecipePage = z.infer<typeof recipePageSchema>;

export const recipeRevisionSchema = z.object({
  id: uuid,
  recipeId: uuid,
  revision: z.number().int().min(1),
  name: z.string(),
  assemblyId: uuid,
  materialId: uuid,
  operation: operationSchema,
  params: recipeParamsSchema,
  result: recipeResultSummarySchema,
  notes: z.string(),
  changeNote: z.string(),
  authorId: uuid,
  authorName: z.string(),
  createdAt: z.string(),
  /** What changed against the revision before, in words ("axial depth 3 → 2 mm"); empty for revision 1. */
  changes: z.array(z.string()).default([]),
});
export type RecipeRevision = z.infer<typeof recipeRevisionSchema>;
export const recipeRevisionListSchema = z.object({ items: z.array(recipeRevisionSchema) });

/** One stored status change of a recipe (newest first in lists). */
export const recipeTransitionSchema = z.object({
  id: uuid,
  recipeId: uuid,
  from: recipeStatusSchema,
  to: recipeStatusSchema,
  comment: z.string(),
  actorId: uuid,
  actorName: z.string(),
  createdAt: z.string(),
});
export type RecipeTransition = z.infer<typeof recipeTransitionSchema>;
export const recipeTransitionListSchema = z.object({ items: z.array(recipeTransitionSchema) });

export const recipeTransitionBodySchema = z.object({
  to: recipeStatusSchema,
  comment: text(1000).default(""),
});
export type RecipeTransitionBody = z.infer<typeof recipeTransitionBodySchema>;

export const recipeRestoreBodySchema = z.object({
  revision: z.number({ error: "Choose a revision" }).int().min(1, "Choose a revision"),
  changeNote: text(500).default(""),
});
export const recipeCopyBodySchema = z.object({ assemblyId: uuid, name: text(160).optional() });

export const recipeSortFields = ["name", "updatedAt", "status", "rpm", "feedMmPerMin", "machineName", "materialName", "cutterName"] as const;
export const recipeListQuerySchema = paginationQuerySchema.extend({
  machineId: uuid.optional(),
  materialId: uuid.optional(),
  cutterId: uuid.optional(),
  operation: operationSchema.optional(),
  status: recipeStatusSchema.optional(),
  q: text(200).optional(),
  sort: z.enum(recipeSortFields).default("updatedAt"),
  order: z.enum(["asc", "desc"]).default("desc"),
  /** true lists the shop's deleted recipes (the bin) instead of the live ones; programmers and up. */
  deleted: z
    .enum(["true", "false", "1", "0"], { error: "Use true or false" })
    .default("false")
    .transform((v) => v === "true" || v === "1"),
});
export type RecipeListQuery = z.infer<typeof recipeListQuerySchema>;

// ---------------------------------------------------------------- cut log
export const cutOutcomes = ["clean", "chatter", "burn_melt", "poor_finish", "cutter_broke", "feed_override", "other"] as const;
export const cutOutcomeSchema = z.enum(cutOutcomes);
export type CutOutcome = z.infer<typeof cutOutcomeSchema>;

export const cutLogBodySchema = z.object({
  outcome: cutOutcomeSchema,
  actualRpm: num("actual spindle speed", 1, 200000),
  actualFeedMmPerMin: num("actual feed", 1, 200000),
  axialDepthMm: num("axial depth", 0.001, 200),
  radialDepthMm: num("radial depth", 0.001, 200),
  feedOverridePct: num("feed override", 1, 300).nullable().default(null),
  note: text(2000).default(""),
});
export type CutLogBody = z.infer<typeof cutLogBodySchema>;

export const cutLogSchema = cutLogBodySchema.extend({
  id: uuid,
  recipeId: uuid,
  recipeRevision: z.number().int(),
  machineId: uuid,
  materialId: uuid,
  userId: uuid,
  userName: z.string(),
  photos: z.array(z.object({ id: uuid, url: z.string(), contentType: z.string(), sizeBytes: z.number().int().optional() })),
  createdAt: z.string(),
  /** For shop-wide lists (planner evidence): which recipe and cutter the cut used. */
  recipeName: z.string().optional(),
  cutterId: uuid.optional(),
  cutterName: z.string().optional(),
  operation: operationSchema.optional(),
});
export type CutLog = z.infer<typeof cutLogSchema>;
export const cutLogPageSchema = pageOf(cutLogSchema);
export type CutLogPage = z.infer<typeof cutLogPageSchema>;

/**
 * Posting a cut log: JSON (`CutLogBody`), or multipart/form-data with the same body as JSON text
 * in the field `data` and up to CUT_LOG_MAX_PHOTOS files in the field `photos`
 * (JPEG, PNG or WebP, each at most the server's limit, 8 MB by default; the type is read from the
 * file's bytes, not from its name or declared type).
 */
export const CUT_LOG_MAX_PHOTOS = 4;
export const cutLogPhotoTypes = ["image/jpeg", "image/png", "image/webp"] as const;

/** Shop-wide cut logs (GET cut-logs): the planner shows these next to a prediction. */
export const cutLogListQuerySchema = paginationQuerySchema.extend({
  machineId: uuid.optional(),
  materialId: uuid.optional(),
  cutterId: uuid.optional(),
  outcome: cutOutcomeSchema.optional(),
});
export type CutLogListQuery = z.infer<typeof cutLogListQuerySchema>;

// ---------------------------------------------------------------- test-cut ladder
export const ladderParameters = ["rpm", "feed", "depth"] as const;
export const ladderParameterSchema = z.enum(ladderParameters);
export type LadderParameter = z.infer<typeof ladderParameterSchema>;
export const ladderBodySchema = z.object({
  parameter: ladderParameterSchema,
  rungs: z.number().int().min(3, "At least 3 rungs").max(7, "At most 7 rungs").default(5),
});
export type LadderBody = z.infer<typeof ladderBodySchema>;

/**
 * A rung's score. Scales: edgeQuality 1 (torn, fuzzy) – 5 (crisp); sound 1 (screams or chatters)
 * – 5 (steady); heat 1 (cool chips and cutter) – 5 (burnt or melted).
 */
export const ladderScoreSchema = z.object({
  edgeQuality: z.number().int().min(1).max(5),
  chips: z.enum(["chips", "mixed", "dust"]),
  sound: z.number().int().min(1).max(5),
  heat: z.number().int().min(1).max(5),
  measuredSizeMm: z.number().finite().nullable(),
  note: z.string(),
  outcome: cutOutcomeSchema.optional(),
  scoredById: uuid.optional(),
  scoredByName: z.string().optional(),
  scoredAt: z.string().optional(),
});
export const ladderRungSchema = z.object({
  index: z.number().int().min(0),
  params: z.object({ rpm: z.number(), feedMmPerMin: z.number(), axialDepthMm: z.number(), radialDepthMm: z.number() }),
  score: ladderScoreSchema.nullable(),
  /** Programmed feed per tooth of this rung [mm]. */
  chipLoadMm: z.number().optional(),
  /** The recipe parameters that reproduce this rung (what choosing it writes as the next revision). */
  recipeParams: recipeParamsSchema.optional(),
  /** The engine's result for this rung (re-checked against every ceiling). */
  result: recipeResultSummarySchema.optional(),
  /** The cut-log entry written when the rung was scored. */
  cutLogId: uuid.nullable().optional(),
});
export type LadderRung = z.infer<typeof ladderRungSchema>;
export const ladderSchema = z.object({
  id: uuid,
  recipeId: uuid,
  parameter: ladderParameterSchema,
  rungs: z.array(ladderRungSchema),
  chosenRung: z.number().int().nullable(),
  createdAt: z.string(),
  /** Revision of the recipe the ladder was built from. */
  baseRevision: z.number().int().min(1).optional(),
  /** The stepped parameter's window, lowest to highest rung, in `unit`. */
  window: z.object({ min: z.number(), max: z.number(), unit: z.string() }).optional(),
  /** How the window was chosen, in words. */
  note: z.string().optional(),
  createdById: uuid.optional(),
  createdByName: z.string().optional(),
  updatedAt: z.string().optional(),
});
export type Ladder = z.infer<typeof ladderSchema>;
export const ladderScoreBodySchema = z.object({
  index: z.number({ error: "Choose a rung" }).int().min(0),
  edgeQuality: z.number().int().min(1, "Score 1–5").max(5, "Score 1–5"),
  chips: z.enum(["chips", "mixed", "dust"]),
  sound: z.number().int().min(1, "Score 1–5").max(5, "Score 1–5"),
  heat: z.number().int().min(1, "Score 1–5").max(5, "Score 1–5"),
  measuredSizeMm: z.number().finite().nullable().default(null),
  note: text(1000).default(""),
  /** How the cut went, for the cut log; when left out it is read from the scores. */
  outcome: cutOutcomeSchema.optional(),
});
export type LadderScoreBody = z.infer<typeof ladderScoreBodySchema>;
export const ladderChooseBodySchema = z.object({ index: z.number({ error: "Choose a rung" }).int().min(0), changeNote: text(500).default("") });
export type LadderChooseBody = z.infer<typeof ladderChooseBodySchema>;

// ---------------------------------------------------------------- shop export
export const shopExportQuerySchema = z.object({ format: z.enum(["json"], { error: "Use format=json (CSV: export/<entity>.csv)" }).default("json") });
export const shopExportEntities = ["cutters", "assemblies", "recipes", "cut-logs"] as const;
export const shopExportEntitySchema = z.enum(shopExportEntities);
export type ShopExportEntity = z.infer<typeof shopExportEntitySchema>;
export const shopExportCsvQuerySchema = z.object({
  /** metric: mm, mm/min, mm³/min; imperial: in, in/min, in³/min (1 in = 25.4 mm exactly). rpm, W and % are the same in both. */
  units: z.enum(unitSystems, { error: "Use units=metric or units=imperial" }).default("metric"),
});
export type ShopExportCsvQuery = z.infer<typeof shopExportCsvQuerySchema>;

/** Everything a shop owns, as GET export?format=json returns it (records in their API shapes). */
export const shopExportSchema = z.object({
  format: z.literal("ringdown-shop-export"),
  version: z.literal(1),
  exportedAt: z.string(),
  shop: z.object({ id: uuid, name: z.string() }),
  units: z.literal("SI: lengths mm, speeds rpm and m/min, feeds mm/min, power W, stiffness N/mm, frequency Hz"),
  materials: z.array(z.record(z.string(), z.unknown())),
  cutters: z.array(z.record(z.string(), z.unknown())),
  machines: z.array(z.record(z.string(), z.unknown())),
  assemblies: z.array(z.record(z.string(), z.unknown())),
  recipes: z.array(
    recipeSchema.extend({ revisions: z.array(recipeRevisionSchema), transitions: z.array(recipeTransitionSchema) }),
  ),
  cutLogs: z.array(cutLogSchema),
  ladders: z.array(ladderSchema),
});
export type ShopExport = z.infer<typeof shopExportSchema>;
