/**
 * Test-cut ladders: programmers build one from a recipe; whoever runs the test cuts (operators
 * included) scores each rung, which also records the cut in the recipe's cut log; a programmer
 * chooses the best rung, which becomes the recipe's next revision.
 */
import type { CutLogBody, CutOutcome, Ladder, LadderBody, LadderChooseBody, LadderScoreBody } from "@ringdown/contracts";
import { RecommendInputError } from "@ringdown/machining";
import { AppError } from "../../http/app-error.js";
import { inTransaction } from "../../db/sequelize.js";
import { findAssemblyRecords, findUsableMaterial } from "../recommendations/planning.repository.js";
import { toValidationError } from "../recommendations/recommendations.service.js";
import { insertCutLog, updateCutLog } from "../cut-logs/cut-logs.repository.js";
import { recipeForLogging } from "../cut-logs/cut-logs.service.js";
import { findRecipe } from "../recipes/recipes.repository.js";
import { reviseRecipe, visibleRecipe, type Actor } from "../recipes/recipes.service.js";
import { findLatestLadder, insertLadder, updateLadder } from "./ladders.repository.js";
import { planLadder } from "./ladder-plan.js";

const NAMES = { rpm: "spindle speed", feed: "feed", depth: "axial depth" } as const;

export async function buildLadder(shopId: string, recipeId: string, body: LadderBody, actor: Actor): Promise<Ladder> {
  const recipe = await visibleRecipe(shopId, recipeId, actor);
  if (recipe.status === "retired") throw AppError.conflict("A retired recipe gets no test-cut ladder. Reinstate it as a draft first.");
  const [records, material] = await Promise.all([findAssemblyRecords(shopId, recipe.assemblyId), findUsableMaterial(shopId, recipe.materialId)]);
  if (!records || !material) throw AppError.conflict("The recipe's assembly, machine, cutter or material has been deleted: a ladder cannot be computed.");
  let plan;
  try {
    plan = planLadder({ ...records, material, operation: recipe.operation, params: recipe.params }, body.parameter, body.rungs);
  } catch (error) {
    if (error instanceof RecommendInputError) throw toValidationError(error);
    throw error;
  }
  if (plan.rungs.length < 2) {
    throw AppError.conflict(`The safe window for the ${NAMES[body.parameter]} of this recipe is too narrow for a ladder: ${plan.note}`);
  }
  await insertLadder(shopId, recipeId, { parameter: body.parameter, rungs: plan.rungs, baseRevision: recipe.revision, window: plan.window, note: plan.note }, actor.userId);
  return (await findLatestLadder(shopId, recipeId))!;
}

export async function latestLadder(shopId: string, recipeId: string, actor: Actor): Promise<Ladder> {
  await recipeForLogging(shopId, recipeId, actor);
  const ladder = await findLatestLadder(shopId, recipeId);
  if (!ladder) throw AppError.notFound("This recipe has no test-cut ladder yet.");
  return ladder;
}

/**
 * How the cut went, read from the scores when the scorer did not say: a poor sound (≤ 2) means
 * chatter, heat ≥ 4 means burning or melting, an edge quality ≤ 2 a poor finish; otherwise clean.
 * (Ringdown's own reading of its 1–5 scales.)
 */
export function outcomeFromScore(score: Pick<LadderScoreBody, "sound" | "heat" | "edgeQuality" | "outcome">): CutOutcome {
  if (score.outcome) return score.outcome;
  if (score.sound <= 2) return "chatter";
  if (score.heat >= 4) return "burn_melt";
  if (score.edgeQuality <= 2) return "poor_finish";
  return "clean";
}

export async function scoreRung(shopId: string, recipeId: string, body: LadderScoreBody, actor: Actor & { name: string }): Promise<Ladder> {
  await inTransaction(async (tx) => {
    const recipe = await recipeForLogging(shopId, recipeId, actor);
    const ladder = await findLatestLadder(shopId, recipeId, tx);
    if (!ladder) throw AppError.notFound("This recipe has no test-cut ladder yet.");
    const rung = ladder.rungs[body.index];
    if (!rung) throw AppError.validation("There is no such rung.", { index: `Choose a rung from 1 to ${ladder.rungs.length}` });
    const outcome = outcomeFromScore(body);
    const size = body.measuredSizeMm === null ? "" : `, measured ${body.measuredSizeMm} mm`;
    const note =
      `Test-cut ladder (${NAMES[ladder.parameter]}), rung ${body.index + 1} of ${ladder.rungs.length}: edge ${body.edgeQuality}/5, ${body.chips}, ` +
      `sound ${body.sound}/5, heat ${body.heat}/5${size}.` +
      (body.note ? ` ${body.note}` : "");
    const log: CutLogBody = {
      outcome,
      actualRpm: rung.params.rpm,
      actualFeedMmPerMin: rung.params.feedMmPerMin,
      axialDepthMm: rung.params.axialDepthMm,
      radialDepthMm: rung.params.radialDepthMm,
      feedOverridePct: null,
      note: note.slice(0, 2000),
    };
    let cutLogId = rung.cutLogId ?? null;
    if (cutLogId) await updateCutLog(shopId, cutLogId, log, tx);
    else cutLogId = await insertCutLog(shopId, recipe, actor.userId, log, tx);
    const rungs = ladder.rungs.map((r) =>
      r.index === body.index
        ? {
            ...r,
            cutLogId,
            score: {
              edgeQuality: body.edgeQuality,
              chips: body.chips,
              sound: body.sound,
              heat: body.heat,
              measuredSizeMm: body.measuredSizeMm,
              note: body.note,
              outcome,
              scoredById: actor.userId,
              scoredByName: actor.name,
              scoredAt: new Date().toISOString(),
            },
          }
        : r,
    );
    await updateLadder(shopId, ladder.id, { rungs }, tx);
  });
  return (await findLatestLadder(shopId, recipeId))!;
}

export async function chooseRung(shopId: string, recipeId: string, body: LadderChooseBody, actor: Actor): Promise<Ladder> {
  await inTransaction(async (tx) => {
    const recipe = await findRecipe(shopId, recipeId, { tx });
    if (!recipe) throw AppError.notFound("Recipe not found.");
    const ladder = await findLatestLadder(shopId, recipeId, tx);
    if (!ladder) throw AppError.notFound("This recipe has no test-cut ladder yet.");
    if (ladder.chosenRung !== null) throw AppError.conflict(`Rung ${ladder.chosenRung + 1} of this ladder was already chosen. Build a new ladder to test again.`);
    const rung = ladder.rungs[body.index];
    if (!rung?.recipeParams) throw AppError.validation("There is no such rung.", { index: `Choose a rung from 1 to ${ladder.rungs.length}` });
    if (ladder.baseRevision !== undefined && recipe.revision !== ladder.baseRevision) {
      throw AppError.conflict(`The recipe changed since this ladder was built (revision ${ladder.baseRevision}, now ${recipe.revision}). Build a new ladder.`);
    }
    const p = rung.params;
    const note =
      `Test-cut ladder (${NAMES[ladder.parameter]}): rung ${body.index + 1} chosen — ${Math.round(p.rpm)} rpm, ${Math.round(p.feedMmPerMin)} mm/min, ` +
      `${Number(p.axialDepthMm.toPrecision(3))} mm deep` +
      (body.changeNote ? `. ${body.changeNote}` : "");
    await reviseRecipe(shopId, recipeId, { params: rung.recipeParams }, note.slice(0, 500), actor, tx);
    await updateLadder(shopId, ladder.id, { chosenRung: body.index }, tx);
  });
  return (await findLatestLadder(shopId, recipeId))!;
}
