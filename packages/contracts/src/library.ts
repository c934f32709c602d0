import { z } from "zod";
import { pageOf, paginationQuerySchema } from "./pagination.js";

/*
 * The shop's library: materials, cutters, machines, cutter assemblies.
 * All lengths in mm, speeds in m/min or rpm, feeds in mm/min, forces in N,
 * power in W, stiffness in N/mm, frequencies in Hz. Display conversion to
 * imperial happens in the web app through the engine's units table.
 */

const uuid = z.string().uuid();
const positive = (what: string, max: number) =>
  z.number({ error: `Enter ${what}` }).finite(`Enter ${what}`).gt(0, `${what} must be more than 0`).max(max, `${what} must be at most ${max}`);
const nonNegative = (what: string, max: number) =>
  z.number({ error: `Enter ${what}` }).finite(`Enter ${what}`).min(0, `${what} cannot be negative`).max(max, `${what} must be at most ${max}`);
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters`);

export const toolMaterials = ["carbide", "hss"] as const;
export const toolMaterialSchema = z.enum(toolMaterials);
export type ToolMaterial = z.infer<typeof toolMaterialSchema>;

// ---------------------------------------------------------------- materials
export const materialGroups = [
  "softwood",
  "hardwood",
  "wood_panel",
  "plastic",
  "foam",
  "composite",
  "aluminium",
  "copper_alloy",
  "steel",
  "stainless",
  "cast_iron",
] as const;
export const materialGroupSchema = z.enum(materialGroups);
export type MaterialGroup = z.infer<typeof materialGroupSchema>;

export const speedRangeSchema = z
  .object({ minMPerMin: positive("minimum cutting speed", 5000), maxMPerMin: positive("maximum cutting speed", 5000) })
  .refine((r) => r.maxMPerMin >= r.minMPerMin, { message: "Maximum must not be below minimum", path: ["maxMPerMin"] });

/** Chip load per tooth at a cutter diameter; the engine interpolates between points. */
export const chipLoadPointSchema = z
  .object({
    diameterMm: positive("diameter", 100),
    minMm: positive("minimum chip load", 2),
    maxMm: positive("maximum chip load", 2),
  })
  .refine((p) => p.maxMm >= p.minMm, { message: "Maximum must not be below minimum", path: ["maxMm"] });

export const materialBodySchema = z.object({
  name: text(120).min(2, "Enter a name"),
  group: materialGroupSchema,
  hardness: text(60).optional().default(""),
  cuttingSpeed: z.object({ carbide: speedRangeSchema, hss: speedRangeSchema }),
  chipLoad: z.array(chipLoadPointSchema).min(1, "Give at least one chip-load point").max(12),
  kc11NPerMm2: positive("kc1.1", 6000).nullable(),
  mc: z.number().finite().min(0, "mc cannot be negative").max(0.6, "mc must be at most 0.6").nullable(),
  unitPowerJPerMm3: positive("unit power", 20).nullable(),
  minChipThicknessMm: positive("minimum chip thickness", 0.5),
  sourceNote: text(2000).min(3, "Say where the values come from"),
});
export type MaterialBody = z.infer<typeof materialBodySchema>;

export const materialSchema = materialBodySchema.extend({
  id: uuid,
  shopId: uuid.nullable(),
  readOnly: z.boolean(),
  copiedFromId: uuid.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** Set while the row is in the shop's bin (restorable). */
  deletedAt: z.string().nullable().optional(),
});
export type Material = z.infer<typeof materialSchema>;

// ---------------------------------------------------------------- cutters
export const cutterShapes = [
  "flat",
  "ball",
  "bull_nose",
  "vee",
  "chamfer",
  "drill",
  "compression",
  "up_spiral",
  "down_spiral",
] as const;
export const cutterShapeSchema = z.enum(cutterShapes);
export type CutterShape = z.infer<typeof cutterShapeSchema>;

export const cutterStatuses = ["proposed", "approved", "retired"] as const;
export const cutterStatusSchema = z.enum(cutterStatuses);
export type CutterStatus = z.infer<typeof cutterStatusSchema>;

/** The cutter's fields (shared by the body, the create body and the stored cutter). */
export const cutterFields = {
  name: text(120).min(1, "Enter a name"),
  shape: cutterShapeSchema,
  diameterMm: positive("diameter", 100),
  flutes: z.number().int("Flutes must be a whole number").min(1, "At least 1 flute").max(12, "At most 12 flutes"),
  fluteLengthMm: positive("flute length", 300),
  overallLengthMm: positive("overall length", 500),
  shankDiameterMm: positive("shank diameter", 60),
  helixDeg: nonNegative("helix angle", 60),
  cornerRadiusMm: nonNegative("corner radius", 50),
  tipAngleDeg: positive("tip angle", 180).nullable().default(null),
  toolMaterial: toolMaterialSchema,
  coating: text(60).default(""),
  maker: text(120).default(""),
  partNumber: text(120).default(""),
  maxRpm: positive("maker's maximum rpm", 200000).nullable(),
  notes: text(2000).default(""),
};

/** Rules across cutter fields (flute length within the overall length, corner radius within the radius). */
export function refineCutter(
  c: { fluteLengthMm: number; overallLengthMm: number; cornerRadiusMm: number; diameterMm: number },
  ctx: z.RefinementCtx,
): void {
  if (c.fluteLengthMm > c.overallLengthMm)
    ctx.addIssue({ code: "custom", path: ["fluteLengthMm"], message: "Flute length cannot exceed the overall length" });
  if (c.cornerRadiusMm > c.diameterMm / 2)
    ctx.addIssue({ code: "custom", path: ["cornerRadiusMm"], message: "Corner radius cannot exceed half the diameter" });
}

export const cutterBodySchema = z.object(cutterFields).superRefine(refineCutter);
export type CutterBody = z.infer<typeof cutterBodySchema>;

export const cutterSchema = z.object({
  ...cutterBodySchema.shape,
  id: uuid,
  shopId: uuid,
  status: cutterStatusSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  deletedAt: z.string().nullable().optional(),
});
export type Cutter = z.infer<typeof cutterSchema>;

export const cutterTransitionBodySchema = z.object({ to: cutterStatusSchema });

// ---------------------------------------------------------------- machines
export const machineKinds = ["gantry_router", "bench_mill", "knee_mill", "machining_centre", "other"] as const;
export const machineKindSchema = z.enum(machineKinds);
export type MachineKind = z.infer<typeof machineKindSchema>;

export const axisDrives = ["belt", "lead_screw", "ball_screw", "rack_pinion"] as const;
export const axisDriveSchema = z.enum(axisDrives);

export const axes = ["x", "y", "z"] as const;
export const axisSchema = z.enum(axes);
export type Axis = z.infer<typeof axisSchema>;

export const machineAxisSchema = z.object({
  drive: axisDriveSchema,
  travelMm: positive("travel", 20000),
  maxFeedMmPerMin: positive("maximum feed", 200000),
  accelerationMmPerS2: positive("acceleration", 100000).nullable(),
  backlashMm: nonNegative("backlash", 5),
  movingMassKg: positive("moving mass", 10000).nullable(),
  /** Static stiffness at the tool in this direction [N/mm]. */
  stiffnessNPerMm: positive("stiffness", 1e7),
});

export const powerPointSchema = z.object({ rpm: positive("rpm", 200000), powerW: positive("power", 200000) });
export const dialSettingSchema = z.object({
  label: text(20).min(1, "Name the dial setting"),
  rpm: positive("rpm", 200000),
  measured: z.boolean().default(false),
});

export const modeSources = ["manual", "estimated", "measured", "fitted"] as const;
export const machineModeSchema = z.object({
  direction: axisSchema,
  frequencyHz: positive("frequency", 50000),
  dampingRatio: positive("damping ratio", 0.5),
  stiffnessNPerMm: positive("modal stiffness", 1e8),
  source: z.enum(modeSources).default("manual"),
  note: text(500).default(""),
});
export type MachineMode = z.infer<typeof machineModeSchema>;

export const ceilingBandSchema = z
  .object({ minHz: positive("band start", 50000), maxHz: positive("band end", 50000), note: text(200).default("") })
  .refine((b) => b.maxHz > b.minHz, { message: "Band end must be above its start", path: ["maxHz"] });

/** The machine's fields (shared by the body, the patch body and the stored machine). */
export const machineFields = {
  name: text(120).min(1, "Enter a name"),
  kind: machineKindSchema,
  spindle: z.object({
    minRpm: positive("minimum rpm", 200000),
    maxRpm: positive("maximum rpm", 200000),
    powerW: positive("spindle power", 200000),
    powerCurve: z.array(powerPointSchema).max(50).default([]),
    dialSettings: z.array(dialSettingSchema).max(30).default([]),
  }),
  axes: z.object({ x: machineAxisSchema, y: machineAxisSchema, z: machineAxisSchema }),
  modes: z.array(machineModeSchema).max(40).default([]),
  deflectionCeilingMm: positive("deflection ceiling", 1).default(0.025),
  avoidBands: z.array(ceilingBandSchema).max(20).default([]),
  modeMarginPct: positive("mode margin", 50).default(10),
  /** Field paths whose values are defaults by machine kind, not measurements. */
  estimatedFields: z.array(text(80)).max(100).default([]),
  notes: text(2000).default(""),
};

export function refineMachine(m: { spindle: { minRpm: number; maxRpm: number } }, ctx: z.RefinementCtx): void {
  if (m.spindle.maxRpm < m.spindle.minRpm)
    ctx.addIssue({ code: "custom", path: ["spindle", "maxRpm"], message: "Maximum rpm must not be below minimum rpm" });
}

export const machineBodySchema = z.object(machineFields).superRefine(refineMachine);
export type MachineBody = z.infer<typeof machineBodySchema>;

/** One position of the machine's measured stiffness map (from its dial-indicator readings). */
export const machineStiffnessPointSchema = z.object({
  xMm: z.number(),
  yMm: z.number(),
  direction: axisSchema,
  /** force / deflection of the reading [N/mm] */
  stiffnessNPerMm: z.number(),
});
export type MachineStiffnessPoint = z.infer<typeof machineStiffnessPointSchema>;

export const machineSchema = z.object({
  ...machineBodySchema.shape,
  /** The measured stiffness map (read-only: comes from the stiffness readings, ignored in bodies).
   *  The planner interpolates it at the job's work position, or takes its worst case over a region. */
  stiffnessPoints: z.array(machineStiffnessPointSchema).optional(),
  id: uuid,
  shopId: uuid,
  createdAt: z.string(),
  updatedAt: z.string(),
  deletedAt: z.string().nullable().optional(),
});
export type Machine = z.infer<typeof machineSchema>;

// ---------------------------------------------------------------- assemblies
export const assemblyBodySchema = z.object({
  machineId: uuid,
  cutterId: uuid,
  holder: text(120).min(1, "Name the holder or collet"),
  stickoutMm: positive("stick-out", 400),
  /** Total indicated runout of the cutter in its holder [mm]. */
  runoutMm: nonNegative("runout", 1),
  notes: text(2000).default(""),
});
export type AssemblyBody = z.infer<typeof assemblyBodySchema>;

export const assemblySchema = assemblyBodySchema.extend({
  id: uuid,
  shopId: uuid,
  createdAt: z.string(),
  updatedAt: z.string(),
  deletedAt: z.string().nullable().optional(),
  /** For lists: the names and cutter status, so a row reads without more requests. */
  machineName: z.string().optional(),
  cutterName: z.string().optional(),
  cutterStatus: cutterStatusSchema.optional(),
  cutterDiameterMm: z.number().optional(),
});
export type Assembly = z.infer<typeof assemblySchema>;

// ---------------------------------------------------------------- list queries, patches, import/export

/**
 * Every field of `shape` optional and without its default, so a PATCH changes only the fields it
 * sends (a defaulted field left out must not be reset to its default).
 */
function patchOf<S extends z.ZodRawShape>(shape: S) {
  const fields: Record<string, z.ZodType> = {};
  for (const [key, schema] of Object.entries(shape)) {
    const bare = (schema instanceof z.ZodDefault ? schema.unwrap() : schema) as z.ZodType;
    fields[key] = bare.optional();
  }
  return z.object(fields) as unknown as z.ZodObject<{
    [K in keyof S]: z.ZodOptional<S[K] extends z.ZodDefault<infer I> ? I : S[K]>;
  }>;
}

const searchText = z.string().trim().max(120, "Use at most 120 characters").optional();
const sortDirectionSchema = z.enum(["asc", "desc"]).default("asc");
/** Query flag "true"/"false" (also "1"/"0"); anything else is a validation error. */
const queryFlag = z
  .enum(["true", "false", "1", "0"], { error: "Use true or false" })
  .default("false")
  .transform((v) => v === "true" || v === "1");

/** Id in a route path; a malformed id is answered like a missing record (404). */
export const recordIdSchema = uuid;

// materials
export const materialScopes = ["all", "global", "shop"] as const;
export const materialListQuerySchema = paginationQuerySchema.extend({
  group: materialGroupSchema.optional(),
  q: searchText,
  /** global: the read-only library; shop: this shop's own rows; all: both. */
  scope: z.enum(materialScopes).default("all"),
  /** true lists the shop's deleted rows (to restore them). */
  deleted: queryFlag,
});
export type MaterialListQuery = z.infer<typeof materialListQuerySchema>;
export const materialPageSchema = pageOf(materialSchema);
export type MaterialPage = z.infer<typeof materialPageSchema>;
export const materialPatchBodySchema = patchOf(materialBodySchema.shape);
export type MaterialPatchBody = z.infer<typeof materialPatchBodySchema>;
/** Copy a global or own material into the shop; the name defaults to "<name> (shop copy)". */
export const materialCopyBodySchema = z.object({ name: text(120).min(2, "Enter a name").optional() });

// cutters
export const cutterSorts = ["name", "diameterMm", "shape", "status", "toolMaterial", "flutes", "createdAt", "updatedAt"] as const;
export const cutterListQuerySchema = paginationQuerySchema.extend({
  status: cutterStatusSchema.optional(),
  shape: cutterShapeSchema.optional(),
  toolMaterial: toolMaterialSchema.optional(),
  q: searchText,
  sort: z.enum(cutterSorts).default("name"),
  dir: sortDirectionSchema,
  deleted: queryFlag,
});
export type CutterListQuery = z.infer<typeof cutterListQuerySchema>;
export const cutterPageSchema = pageOf(cutterSchema);
export type CutterPage = z.infer<typeof cutterPageSchema>;

/** Create: programmers propose; tooling managers and owners may add an approved cutter directly. */
export const cutterCreateBodySchema = z
  .object({ ...cutterFields, status: z.enum(["proposed", "approved"]).optional() })
  .superRefine(refineCutter);
export type CutterCreateBody = z.infer<typeof cutterCreateBodySchema>;
export const cutterPatchBodySchema = patchOf(cutterFields);
export type CutterPatchBody = z.infer<typeof cutterPatchBodySchema>;
export type CutterTransitionBody = z.infer<typeof cutterTransitionBodySchema>;

export const unitSystems = ["metric", "imperial"] as const;
export const cutterExportQuerySchema = z.object({
  /** metric writes *_mm columns; imperial writes *_in columns (1 in = 25.4 mm exactly). */
  units: z.enum(unitSystems).default("metric"),
  status: cutterStatusSchema.optional(),
});
export type CutterExportQuery = z.infer<typeof cutterExportQuerySchema>;
export const cutterImportQuerySchema = z.object({ dryRun: queryFlag });

/** One data row of an imported CSV: its line in the file, its cells, and what is wrong with it. */
export const cutterImportRowSchema = z.object({
  /** Line number in the file (the header is line 1). */
  line: z.number().int().min(1),
  /** Cells by column header, as written in the file. */
  values: z.record(z.string(), z.string()),
  /** Column header (or "row") → message; empty when the row is valid. */
  errors: z.record(z.string(), z.string()),
  /** Things worth a look that do not stop the import (e.g. a cutter of that name exists). */
  warnings: z.array(z.string()),
  /** The cutter the row becomes (mm, with its status), when it is valid. */
  cutter: z.object({ ...cutterFields, status: cutterStatusSchema }).nullable(),
});
export type CutterImportRow = z.infer<typeof cutterImportRowSchema>;
export const cutterImportReportSchema = z.object({
  dryRun: z.boolean(),
  /** Problems with the file as a whole (unknown or missing columns…). */
  fileErrors: z.array(z.string()),
  rows: z.array(cutterImportRowSchema),
  counts: z.object({ total: z.number().int(), valid: z.number().int(), invalid: z.number().int() }),
  /** Cutters written (0 for a dry run or a refused import). */
  imported: z.number().int().min(0),
});
export type CutterImportReport = z.infer<typeof cutterImportReportSchema>;
/** A refused import: the usual error envelope plus the full report. */
export const cutterImportErrorSchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), fields: z.record(z.string(), z.string()).optional() }),
  report: cutterImportReportSchema,
});

// machines
export const machineListQuerySchema = paginationQuerySchema.extend({
  kind: machineKindSchema.optional(),
  q: searchText,
  deleted: queryFlag,
});
export type MachineListQuery = z.infer<typeof machineListQuerySchema>;
export const machinePageSchema = pageOf(machineSchema);
export type MachinePage = z.infer<typeof machinePageSchema>;
/** PATCH: fields sent replace the stored ones; `modes`, when sent, replaces the whole mode set. */
export const machinePatchBodySchema = patchOf(machineFields);
export type MachinePatchBody = z.infer<typeof machinePatchBodySchema>;
export const machineDefaultsQuerySchema = z.object({ kind: machineKindSchema });
/** A full machine body of defaults for a kind; `estimatedFields` names every defaulted field. */
export const machineDefaultsSchema = z.object(machineFields);

// assemblies
export const assemblyListQuerySchema = paginationQuerySchema.extend({
  machineId: uuid.optional(),
  cutterId: uuid.optional(),
  deleted: queryFlag,
});
export type AssemblyListQuery = z.infer<typeof assemblyListQuerySchema>;
export const assemblyPageSchema = pageOf(assemblySchema);
export type AssemblyPage = z.infer<typeof assemblyPageSchema>;
export const assemblyPatchBodySchema = patchOf(assemblyBodySchema.shape);
export type AssemblyPatchBody = z.infer<typeof assemblyPatchBodySchema>;
