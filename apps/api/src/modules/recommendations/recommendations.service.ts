import {
  planRecipe,
  safetyNotes,
  summarizeRecommendation,
  type Cutter,
  type Machine,
  type Material,
  type Assembly,
  type Operation,
  type RecipeParams,
  type RecipeResultSummary,
  type RecommendationResponse,
} from "@ringdown/contracts";
import { RecommendInputError, type Recommendation } from "@ringdown/machining";
import { AppError } from "../../http/app-error.js";
import type { Tx } from "../../db/sequelize.js";
import { findAssemblyRecords, findUsableMaterial } from "./planning.repository.js";

export interface PlanningRequest {
  assemblyId: string;
  materialId: string;
  operation: Operation;
  params: RecipeParams;
}

export interface ComputedPlan {
  machine: Machine;
  assembly: Assembly;
  cutter: Cutter;
  material: Material;
  recommendation: Recommendation;
  summary: RecipeResultSummary;
}

/** Where an engine input path points in a request ({ assemblyId, materialId, operation, params }). */
function requestField(enginePath: string): string {
  const exact: Record<string, string> = {
    "engagement.axialDepthMm": "params.axialDepthMm",
    "engagement.radialDepthMm": "params.radialDepthMm",
    "preferences.cuttingSpeedMPerMin": "params.rpmOverride",
    "preferences.chipLoadMm": "params.chipLoadOverrideMm",
    workPosition: "params.workPositionXMm",
    millingDirection: "params.millingDirection",
    operation: "operation",
  };
  if (exact[enginePath]) return exact[enginePath];
  if (enginePath.startsWith("material")) return "materialId";
  // Cutter, holder and machine data all come with the assembly.
  return "assemblyId";
}

const LABELS: Record<string, string> = {
  "engagement.axialDepthMm": "Axial depth",
  "engagement.radialDepthMm": "Radial depth",
  "preferences.cuttingSpeedMPerMin": "Chosen spindle speed",
  "preferences.chipLoadMm": "Chosen chip load",
  workPosition: "Work position",
  millingDirection: "Milling direction",
  operation: "Operation",
};
const SUBJECTS: Record<string, string> = { cutter: "Cutter", machine: "Machine", material: "Material" };

/** "cutter.runoutTirMm" → "Cutter runout tir"; "machine.spindle.maxRpm" → "Machine spindle max". */
function labelOf(path: string): string {
  if (LABELS[path]) return LABELS[path];
  const [head = "", ...rest] = path.split(".");
  const words = rest
    .join(" ")
    .replace(/\[(\d+)\]/g, " $1")
    .replace(/(Mm|Deg|Hz|Rpm|GPa|NPerMm2?|MPerMin|JPerMm3|W)$/g, "")
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .trim();
  return `${SUBJECTS[head] ?? head}${words ? ` ${words}` : ""}`;
}

/** Turns the engine's input errors into field errors of the request ("Axial depth is deeper than…"). */
export function toValidationError(error: RecommendInputError): AppError {
  const fields: Record<string, string> = {};
  for (const [path, message] of Object.entries(error.fields)) {
    const key = requestField(path);
    const sentence = `${labelOf(path)} ${message}`;
    fields[key] = fields[key] ? `${fields[key]}; ${sentence}` : sentence;
  }
  return AppError.validation("These settings cannot be computed.", fields);
}

/**
 * Loads the shop's assembly (with machine and cutter) and material and runs the engine.
 * @throws AppError validation_failed when a record is missing or the engine refuses the input
 */
export async function computePlan(shopId: string, request: PlanningRequest, tx?: Tx): Promise<ComputedPlan> {
  const [records, material] = await Promise.all([
    findAssemblyRecords(shopId, request.assemblyId, tx),
    findUsableMaterial(shopId, request.materialId, tx),
  ]);
  const missing: Record<string, string> = {};
  if (!records) missing.assemblyId = "No such cutter assembly in this shop (or its machine or cutter was deleted).";
  if (!material) missing.materialId = "No such material in this shop's library.";
  if (!records || !material) throw AppError.validation("Choose an existing assembly and material.", missing);
  const recommendation = runEngine({ ...records, material, operation: request.operation, params: request.params });
  return { ...records, material, recommendation, summary: summarizeRecommendation(recommendation) };
}

/** Runs the engine on loaded records; engine input errors become validation errors. */
export function runEngine(input: Parameters<typeof planRecipe>[0]): Recommendation {
  try {
    return planRecipe(input);
  } catch (error) {
    if (error instanceof RecommendInputError) throw toValidationError(error);
    throw error;
  }
}

export async function recommendForShop(shopId: string, request: PlanningRequest): Promise<RecommendationResponse> {
  const plan = await computePlan(shopId, request);
  return {
    recommendation: plan.recommendation as unknown as RecommendationResponse["recommendation"],
    summary: plan.summary,
    safetyNotes: [...safetyNotes],
    context: {
      machineId: plan.machine.id,
      machineName: plan.machine.name,
      cutterId: plan.cutter.id,
      cutterName: plan.cutter.name,
      materialName: plan.material.name,
    },
  };
}
