import { z } from "zod";
import { paginationQuerySchema } from "./pagination.js";

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

/** What the programmer chooses; the engine computes the rest. */
export const recipeParamsSchema = z.object({
  axialDepthMm: num("axial depth", 0.001, 200),
  radialDepthMm: num("radial depth", 0.001, 200),
  workPositionXMm: num("work position X", 0, 20000).default(0),
  workPositionYMm: num("work position Y", 0, 20000).default(0),
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

export const recipeUpdateBodySchema = recipeBodySchema.partial().extend({
  changeNote: text(500).default(""),
});

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
});
export type Recipe = z.infer<typeof recipeSchema>;

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
});
export type RecipeRevision = z.infer<typeof recipeRevisionSchema>;

export const recipeTransitionBodySchema = z.object({
  to: recipeStatusSchema,
  comment: text(1000).default(""),
});
export type RecipeTransitionBody = z.infer<typeof recipeTransitionBodySchema>;

export const recipeRestoreBodySchema = z.object({ revision: z.number().int().min(1) });
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
  photos: z.array(z.object({ id: uuid, url: z.string(), contentType: z.string() })),
  createdAt: z.string(),
});
export type CutLog = z.infer<typeof cutLogSchema>;

// ---------------------------------------------------------------- test-cut ladder
export const ladderParameters = ["rpm", "feed", "depth"] as const;
export const ladderBodySchema = z.object({
  parameter: z.enum(ladderParameters),
  rungs: z.number().int().min(3, "At least 3 rungs").max(7, "At most 7 rungs").default(5),
});
export const ladderRungSchema = z.object({
  index: z.number().int().min(0),
  params: z.object({ rpm: z.number(), feedMmPerMin: z.number(), axialDepthMm: z.number(), radialDepthMm: z.number() }),
  score: z
    .object({
      edgeQuality: z.number().int().min(1).max(5),
      chips: z.enum(["chips", "mixed", "dust"]),
      sound: z.number().int().min(1).max(5),
      heat: z.number().int().min(1).max(5),
      measuredSizeMm: z.number().finite().nullable(),
      note: z.string(),
    })
    .nullable(),
});
export const ladderSchema = z.object({
  id: uuid,
  recipeId: uuid,
  parameter: z.enum(ladderParameters),
  rungs: z.array(ladderRungSchema),
  chosenRung: z.number().int().nullable(),
  createdAt: z.string(),
});
export type Ladder = z.infer<typeof ladderSchema>;
export const ladderScoreBodySchema = z.object({
  index: z.number().int().min(0),
  edgeQuality: z.number().int().min(1, "Score 1–5").max(5, "Score 1–5"),
  chips: z.enum(["chips", "mixed", "dust"]),
  sound: z.number().int().min(1, "Score 1–5").max(5, "Score 1–5"),
  heat: z.number().int().min(1, "Score 1–5").max(5, "Score 1–5"),
  measuredSizeMm: z.number().finite().nullable().default(null),
  note: text(1000).default(""),
});
export const ladderChooseBodySchema = z.object({ index: z.number().int().min(0) });
