/**
 * The planning mapper: turns the shop's library records (contract shapes) and the programmer's
 * choices into the engine's input, and the engine's result into the summary stored with a recipe.
 * The browser planner and the server call the same functions, so a number shown while typing is
 * the number the server saves.
 *
 * How the shop's records are mapped (each approximation is reported by `planningNotes`):
 *  - Cutter shapes the engine knows map one to one: flat → flat, ball → ball, bull_nose → bull
 *    (with its corner radius), drill → drill.
 *  - Straight-walled router bits (compression, up_spiral, down_spiral) map to flat: the engine's
 *    force, deflection and stability models depend on diameter, flutes, lengths and helix, not on
 *    the helix hand or the flute split, which decide where chips go and which face stays clean.
 *  - Vee and chamfer cutters map to a flat cutter of the diameter engaged at the asked depth,
 *    D_eng = min(D, 2 · ap · tan(θ/2)) with θ the included tip angle (90° assumed when the cutter
 *    has none), and never less than 10 % of D. Chip load comes from the table at D_eng and the speed
 *    targets the cutting speed at the engaged rim; deflection is computed for the thinner engaged
 *    section (conservative). The stepover is held within D_eng.
 *  - The material's chip load per diameter is a range (min–max); the engine takes one value per
 *    diameter: the middle of the range, as the engine also targets the middle of the speed range.
 *  - An rpm override becomes a preferred cutting speed vc = π · D_eff · n / 1000 at the effective
 *    diameter the engine uses (ball and bull nose at shallow depth), so the engine starts from
 *    exactly that speed and still moves it off modes and below every ceiling.
 *  - Slot and ramp engage the full diameter and drill is axial: their stepover is ignored.
 *  - Machine stiffness: the measured stiffness map (X and Y readings) when the machine has one,
 *    which the engine interpolates at the work position, or whose worst case it takes over the
 *    work region when the programmer marks one; per-axis static stiffness (X, Y) otherwise and for
 *    a direction without readings.
 *  - Machine: per-axis static stiffness (X, Y), max feeds, backlash, modes (their notes become
 *    labels), avoided bands, mode margin (% → fraction), dial settings (measured rpm) and power
 *    curve are passed as they are.
 */
import {
  SAFETY_NOTES,
  ballNoseEffectiveDiameterMm,
  cornerRadiusEffectiveDiameterMm,
  recommend,
  type CutterShape as EngineCutterShape,
  type RecommendInput,
  type Recommendation,
} from "@ringdown/machining";
import { z } from "zod";
import type { Assembly, Cutter, CutterShape, Machine, Material } from "./library.js";
import {
  operationSchema,
  recipeParamsSchema,
  recipeResultSummarySchema,
  type Operation,
  type RecipeParams,
  type RecipeResultSummary,
} from "./recipes.js";

/** Everything the engine needs for one cut, in contract shapes. */
export interface PlanningInput {
  machine: Pick<Machine, "name" | "spindle" | "axes" | "modes" | "deflectionCeilingMm" | "avoidBands" | "modeMarginPct" | "stiffnessPoints">;
  assembly: Pick<Assembly, "stickoutMm" | "runoutMm">;
  cutter: Pick<
    Cutter,
    "shape" | "diameterMm" | "flutes" | "fluteLengthMm" | "shankDiameterMm" | "helixDeg" | "cornerRadiusMm" | "tipAngleDeg" | "toolMaterial" | "maxRpm"
  >;
  material: Pick<Material, "name" | "cuttingSpeed" | "chipLoad" | "kc11NPerMm2" | "mc" | "unitPowerJPerMm3" | "minChipThicknessMm">;
  operation: Operation;
  params: RecipeParams;
}

/** Included tip angle assumed for a vee or chamfer cutter that has none [deg] (common practice, no published source). */
export const DEFAULT_VEE_ANGLE_DEG = 90;
/** Smallest engaged diameter used for a vee or chamfer cutter, as a fraction of its diameter [-]. */
export const MIN_ENGAGED_FRACTION = 0.1;

const FULL_WIDTH_OPERATIONS: ReadonlySet<Operation> = new Set(["slot", "ramp", "drill"]);
const ENGINE_SHAPE: Record<CutterShape, EngineCutterShape> = {
  flat: "flat",
  ball: "ball",
  bull_nose: "bull",
  vee: "flat",
  chamfer: "flat",
  drill: "drill",
  compression: "flat",
  up_spiral: "flat",
  down_spiral: "flat",
};

function isPointed(shape: CutterShape): boolean {
  return shape === "vee" || shape === "chamfer";
}

/**
 * Diameter of a vee or chamfer cutter engaged at depth ap: D_eng = 2 · ap · tan(θ/2), held between
 * 10 % of D and D (geometry of a cone with included angle θ) [mm].
 */
export function engagedVeeDiameterMm(input: { diameterMm: number; tipAngleDeg: number | null; axialDepthMm: number }): number {
  const theta = ((input.tipAngleDeg ?? DEFAULT_VEE_ANGLE_DEG) * Math.PI) / 180;
  const width = 2 * input.axialDepthMm * Math.tan(theta / 2);
  return Math.min(input.diameterMm, Math.max(MIN_ENGAGED_FRACTION * input.diameterMm, width));
}

/** Cutting diameter the engine will see for this cutter at this depth (before ball/bull contact). */
function engineDiameterMm(p: PlanningInput): number {
  const c = p.cutter;
  return isPointed(c.shape) ? engagedVeeDiameterMm({ diameterMm: c.diameterMm, tipAngleDeg: c.tipAngleDeg, axialDepthMm: p.params.axialDepthMm }) : c.diameterMm;
}

/**
 * Effective diameter the engine uses to turn a cutting speed into rpm: the contact circle of a
 * ball or bull nose at a shallow depth, the full (engine) diameter otherwise [mm].
 */
function effectiveDiameterMm(p: PlanningInput, shape: EngineCutterShape, diameterMm: number): number {
  if (p.operation === "drill") return diameterMm;
  const ap = p.params.axialDepthMm;
  if (shape === "ball") return ballNoseEffectiveDiameterMm({ diameterMm, axialDepthMm: ap });
  if (shape === "bull") {
    return cornerRadiusEffectiveDiameterMm({ diameterMm, cornerRadiusMm: Math.min(p.cutter.cornerRadiusMm, diameterMm / 2), axialDepthMm: ap });
  }
  return diameterMm;
}

/** Maps contract objects and the programmer's choices onto the engine's `RecommendInput`. */
export function toRecommendInput(p: PlanningInput): RecommendInput {
  const { machine, assembly, cutter, material, operation, params } = p;
  const shape = ENGINE_SHAPE[cutter.shape];
  const diameterMm = engineDiameterMm(p);
  const pointed = isPointed(cutter.shape);
  const bull = shape === "bull";
  // The measured map across the bed (X and Y pushes: the engine's lateral stiffness).
  const lateralPoints = (machine.stiffnessPoints ?? []).filter((pt) => pt.direction !== "z");

  const input: RecommendInput = {
    cutter: {
      shape,
      diameterMm,
      flutes: cutter.flutes,
      fluteLengthMm: cutter.fluteLengthMm,
      stickoutMm: assembly.stickoutMm,
      shankDiameterMm: cutter.shankDiameterMm,
      toolMaterial: cutter.toolMaterial,
      helixAngleDeg: cutter.helixDeg,
      runoutTirMm: assembly.runoutMm,
      ...(bull ? { cornerRadiusMm: cutter.cornerRadiusMm } : {}),
      ...(cutter.maxRpm !== null ? { maxRpm: cutter.maxRpm } : {}),
    },
    material: {
      name: material.name,
      cuttingSpeedMPerMin: { carbide: material.cuttingSpeed.carbide, hss: material.cuttingSpeed.hss },
      chipLoad: material.chipLoad.map((pt) => ({ diameterMm: pt.diameterMm, chipLoadMm: (pt.minMm + pt.maxMm) / 2 })),
      minChipThicknessMm: material.minChipThicknessMm,
      ...(material.kc11NPerMm2 !== null && material.mc !== null ? { kc11NPerMm2: material.kc11NPerMm2, mc: material.mc } : {}),
      ...(material.unitPowerJPerMm3 !== null ? { unitPowerJPerMm3: material.unitPowerJPerMm3 } : {}),
    },
    machine: {
      name: machine.name,
      spindle: {
        minRpm: machine.spindle.minRpm,
        maxRpm: machine.spindle.maxRpm,
        ratedPowerW: machine.spindle.powerW,
        ...(machine.spindle.powerCurve.length > 0 ? { powerCurve: machine.spindle.powerCurve.map((pt) => ({ rpm: pt.rpm, powerW: pt.powerW })) } : {}),
        ...(machine.spindle.dialSettings.length > 0 ? { dialSpeeds: machine.spindle.dialSettings.map((d) => ({ label: d.label, rpm: d.rpm })) } : {}),
      },
      maxFeedMmPerMin: { x: machine.axes.x.maxFeedMmPerMin, y: machine.axes.y.maxFeedMmPerMin, z: machine.axes.z.maxFeedMmPerMin },
      stiffnessNPerMm: { x: machine.axes.x.stiffnessNPerMm, y: machine.axes.y.stiffnessNPerMm },
      ...(lateralPoints.length > 0 ? { stiffnessMap: lateralPoints } : {}),
      modes: machine.modes.map((m) => ({
        direction: m.direction,
        frequencyHz: m.frequencyHz,
        dampingRatio: m.dampingRatio,
        stiffnessNPerMm: m.stiffnessNPerMm,
        ...(m.note ? { label: m.note } : {}),
      })),
      deflectionCeilingMm: machine.deflectionCeilingMm,
      backlashMm: { x: machine.axes.x.backlashMm, y: machine.axes.y.backlashMm, z: machine.axes.z.backlashMm },
      avoidBands: machine.avoidBands.map((b) => ({ minHz: b.minHz, maxHz: b.maxHz, ...(b.note ? { label: b.note } : {}) })),
      resonanceMargin: machine.modeMarginPct / 100,
    },
    operation,
    engagement: {
      axialDepthMm: params.axialDepthMm,
      ...(FULL_WIDTH_OPERATIONS.has(operation) ? {} : { radialDepthMm: pointed ? Math.min(params.radialDepthMm, diameterMm) : params.radialDepthMm }),
    },
    workPosition: { xMm: params.workPositionXMm, yMm: params.workPositionYMm },
    ...(params.workRegion ? { workRegion: { ...params.workRegion } } : {}),
    millingDirection: params.millingDirection,
  };

  const preferences: NonNullable<RecommendInput["preferences"]> = {};
  if (params.rpmOverride !== null) {
    // vc = π · D_eff · n / 1000: the engine's speed formula run backwards, so it starts at exactly n.
    preferences.cuttingSpeedMPerMin = (Math.PI * effectiveDiameterMm(p, shape, diameterMm) * params.rpmOverride) / 1000;
  }
  if (params.chipLoadOverrideMm !== null) preferences.chipLoadMm = params.chipLoadOverrideMm;
  if (Object.keys(preferences).length > 0) input.preferences = preferences;
  return input;
}

/** Plain-language notes on how the shop's records were approximated for the engine (empty when exact). */
export function planningNotes(p: PlanningInput): string[] {
  const notes: string[] = [];
  const c = p.cutter;
  if (isPointed(c.shape)) {
    const d = engineDiameterMm(p);
    const angle = c.tipAngleDeg ?? DEFAULT_VEE_ANGLE_DEG;
    notes.push(
      `The ${c.shape === "vee" ? "vee" : "chamfer"} cutter is computed as a straight cutter of the Ø${round(d)} mm it engages at ${round(p.params.axialDepthMm)} mm depth ` +
        `(${round(angle)}° included tip angle${c.tipAngleDeg === null ? ", assumed: enter the cutter's tip angle" : ""}).`,
    );
    if (!FULL_WIDTH_OPERATIONS.has(p.operation) && p.params.radialDepthMm > d) {
      notes.push(`The stepover is limited to the engaged width, ${round(d)} mm.`);
    }
  } else if (c.shape === "compression" || c.shape === "up_spiral" || c.shape === "down_spiral") {
    notes.push("Computed as a straight end mill: the helix hand decides where chips go, not the forces or the deflection modelled here.");
  }
  if (FULL_WIDTH_OPERATIONS.has(p.operation) && p.params.radialDepthMm !== (isPointed(c.shape) ? engineDiameterMm(p) : c.diameterMm)) {
    notes.push(`A ${p.operation} engages the full diameter: the stepover entered is not used.`);
  }
  if (p.material.chipLoad.some((pt) => pt.maxMm > pt.minMm)) {
    notes.push("Chip load taken at the middle of the material's range for each diameter.");
  }
  return notes;
}

function round(v: number): string {
  return String(Number(v.toPrecision(3)));
}

/**
 * Runs the engine for a planning input and adds the mapping notes to its warnings (as
 * assumptions), so what the planner shows and what the server stores are the same.
 * @throws RecommendInputError from the engine for impossible input (field paths are the engine's)
 */
export function planRecipe(p: PlanningInput): Recommendation {
  const rec = recommend(toRecommendInput(p));
  const notes = planningNotes(p);
  if (notes.length === 0) return rec;
  return { ...rec, warnings: [...rec.warnings, ...notes.map((message) => ({ id: "assumption" as const, severity: "caution" as const, message }))] };
}

/**
 * The headline numbers stored with each recipe revision. `chipLoadMm` is the programmed feed per
 * tooth (after chip-thinning compensation and any reduction); `bindingLimit` names the ceilings
 * that reduced or moved the recipe, in the engine's order, joined by "; " (null when none did);
 * `stable` is null when chatter stability was not checked.
 */
export function summarizeRecommendation(rec: Recommendation): RecipeResultSummary {
  const binding = rec.limits.filter((l) => l.binding).map((l) => l.label);
  return {
    rpm: rec.rpm,
    feedMmPerMin: rec.feedMmPerMin,
    chipLoadMm: rec.compensatedChipLoadMm,
    materialRemovalRateMm3PerMin: rec.materialRemovalRateMm3PerMin,
    powerW: rec.powerW,
    totalDeflectionMm: rec.totalDeflectionMm,
    axialDepthMm: rec.axialDepthMm,
    radialDepthMm: rec.radialDepthMm,
    bindingLimit: binding.length > 0 ? binding.join("; ") : null,
    stable: rec.stability.checked ? rec.stability.stable : null,
    warnings: rec.warnings.map((w) => w.message),
  };
}

/** The cautions shown wherever a recipe is shown (from the engine). */
export const safetyNotes: readonly string[] = SAFETY_NOTES;

// ---------------------------------------------------------------- POST recommendations

export const recommendationBodySchema = z.object({
  assemblyId: z.string().uuid(),
  materialId: z.string().uuid(),
  operation: operationSchema,
  params: recipeParamsSchema,
});
export type RecommendationBody = z.infer<typeof recommendationBodySchema>;

const limitCheckSchema = z.object({
  id: z.string(),
  label: z.string(),
  value: z.number(),
  ceiling: z.number(),
  unit: z.string(),
  kind: z.enum(["max", "min"]),
  binding: z.boolean(),
  holds: z.boolean(),
  detail: z.string(),
});
const warningSchema = z.object({ id: z.string(), severity: z.enum(["caution", "warning"]), message: z.string() });
const explanationSchema = z.object({
  formula: z.string(),
  inputs: z.array(z.object({ name: z.string(), value: z.union([z.number(), z.string()]), unit: z.string() })),
  boundBy: z.array(z.string()),
  source: z.string(),
  notes: z.array(z.string()),
});

/**
 * The engine's `Recommendation` as it crosses the wire. The headline fields are checked; the rest
 * of the engine's output passes through unchanged (see @ringdown/machining's types for every field).
 */
export const recommendationSchema = z.looseObject({
  ok: z.boolean(),
  operation: z.string(),
  rpm: z.number(),
  spindleDial: z.object({ label: z.string(), rpm: z.number() }).nullable(),
  cuttingSpeedMPerMin: z.number(),
  feedMmPerMin: z.number(),
  chipLoadMm: z.number(),
  compensatedChipLoadMm: z.number(),
  axialDepthMm: z.number(),
  radialDepthMm: z.number(),
  materialRemovalRateMm3PerMin: z.number(),
  powerW: z.number(),
  availablePowerW: z.number(),
  totalDeflectionMm: z.number(),
  deflectionCeilingMm: z.number(),
  toothPassingFrequencyHz: z.number(),
  stability: z.looseObject({ checked: z.boolean(), stable: z.boolean(), limitingDepthMm: z.number().nullable() }),
  limits: z.array(limitCheckSchema),
  warnings: z.array(warningSchema),
  adjustments: z.array(z.string()),
  explain: z.record(z.string(), explanationSchema),
  safetyNotes: z.array(z.string()),
});

/** Response of POST /api/shops/:shopId/recommendations. */
export const recommendationResponseSchema = z.object({
  recommendation: recommendationSchema,
  summary: recipeResultSummarySchema,
  /** The cautions to show beside the numbers (same as recommendation.safetyNotes). */
  safetyNotes: z.array(z.string()),
  /** Names of the records used, for headings. */
  context: z.object({
    machineId: z.string().uuid(),
    machineName: z.string(),
    cutterId: z.string().uuid(),
    cutterName: z.string(),
    materialName: z.string(),
  }),
});
export type RecommendationResponse = z.infer<typeof recommendationResponseSchema>;
