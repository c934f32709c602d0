/**
 * Recipe rules: the server computes every result with the engine before saving; every change is a
 * new revision; the life cycle draft → trial → proven → approved (→ retired) is enforced here with
 * the roles allowed to take each step.
 */
import type {
  Recipe,
  RecipeBody,
  RecipeListQuery,
  RecipePage,
  RecipeParams,
  RecipeResultSummary,
  RecipeRevision,
  RecipeStatus,
  RecipeTransition,
  Role,
} from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { inTransaction, type Tx } from "../../db/sequelize.js";
import { roleAtLeast } from "../shops/require-shop-role.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { computePlan } from "../recommendations/recommendations.service.js";
import { findAssemblyRecords } from "../recommendations/planning.repository.js";
import {
  countCleanCutsOnMachine,
  findRecipe,
  findRevision,
  insertRecipe,
  insertRevision,
  insertTransition,
  listRecipes,
  listRevisions,
  listTransitions,
  lockRecipe,
  setRecipeDeleted,
  setRecipeStatus,
  clearNeedsRecheck,
  updateRecipeState,
  type RecipeState,
  type RevisionRecord,
} from "./recipes.repository.js";

/** The caller: their role decides what they may do; the rest names them in the audit log. */
export interface Actor extends AuditActor {
  userId: string;
  role: Role;
}

const recipeSubject = (r: { id: string; name: string }) => ({ type: "recipe" as const, id: r.id, label: r.name });

const notFound = () => AppError.notFound("Recipe not found.");
/** "a draft", "an approved"… */
const withArticle = (word: string): string => `${/^[aeiou]/.test(word) ? "an" : "a"} ${word}`;

/** Operators work from approved recipes only; everyone else sees every status. */
export function canSeeStatus(role: Role, status: RecipeStatus): boolean {
  return role !== "operator" || status === "approved";
}

/** A recipe the actor may see, or 404 (operators get 404 for anything not approved). */
export async function visibleRecipe(shopId: string, id: string, actor: Actor): Promise<Recipe> {
  const recipe = await findRecipe(shopId, id);
  if (!recipe || !canSeeStatus(actor.role, recipe.status)) throw notFound();
  return recipe;
}

export async function listShopRecipes(shopId: string, query: RecipeListQuery, actor: Actor): Promise<RecipePage> {
  if (query.deleted && !roleAtLeast(actor.role, "programmer")) throw AppError.forbidden("Only programmers, tooling managers and owners can see deleted recipes.");
  const { items, total } = await listRecipes(shopId, query, actor.role === "operator");
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** Runs the engine for a recipe state and returns what is stored (machine and cutter from the assembly). */
async function computeState(
  shopId: string,
  input: { name: string; assemblyId: string; materialId: string; operation: RecipeState["operation"]; params: RecipeParams; notes: string },
  tx: Tx,
  options: { refuseRetiredCutter: boolean },
): Promise<RecipeState & { machineName: string }> {
  const plan = await computePlan(shopId, input, tx);
  if (options.refuseRetiredCutter && plan.cutter.status === "retired") {
    throw AppError.validation("This cutter is retired.", { assemblyId: `${plan.cutter.name} is retired: choose an assembly with a cutter in use.` });
  }
  return {
    name: input.name,
    assemblyId: input.assemblyId,
    machineId: plan.machine.id,
    cutterId: plan.cutter.id,
    materialId: input.materialId,
    operation: input.operation,
    params: input.params,
    result: plan.summary,
    notes: input.notes,
    machineName: plan.machine.name,
  };
}

export async function createRecipe(shopId: string, body: RecipeBody, actor: Actor): Promise<Recipe> {
  const id = await inTransaction(async (tx) => {
    const { machineName: _m, ...state } = await computeState(shopId, body, tx, { refuseRetiredCutter: true });
    const recipeId = await insertRecipe(shopId, state, actor.userId, tx);
    await insertRevision(shopId, recipeId, 1, state, "Created", actor.userId, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "recipe.created", subject: recipeSubject({ id: recipeId, name: state.name }), detail: { status: "draft" } });
    return recipeId;
  });
  return (await findRecipe(shopId, id))!;
}

const sameJson = (a: unknown, b: unknown): boolean => JSON.stringify(canonical(a)) === JSON.stringify(canonical(b));
function canonical(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(canonical);
  if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).sort(([a], [b]) => a.localeCompare(b)).map(([k, x]) => [k, canonical(x)]));
  return v;
}

/** Relative change that counts as the machine running a different recipe [-]. */
const MOVED = 0.005;

/**
 * What moved between two results by more than 0.5 % (speed, feed, depths), in words, or "" when
 * nothing did: a proven recipe whose numbers move has not been proven with those numbers.
 */
function numbersMoved(before: RecipeResultSummary, after: RecipeResultSummary): string {
  const parts: string[] = [];
  const check = (label: string, unit: string, a: number | undefined, b: number | undefined) => {
    if (a === undefined || b === undefined) return;
    if (Math.abs(b - a) > MOVED * Math.max(Math.abs(a), Math.abs(b))) parts.push(`${label} ${Number(a.toPrecision(4))} → ${Number(b.toPrecision(4))} ${unit}`);
  };
  check("speed", "rpm", before.rpm, after.rpm);
  check("feed", "mm/min", before.feedMmPerMin, after.feedMmPerMin);
  check("axial depth", "mm", before.axialDepthMm, after.axialDepthMm);
  check("radial depth", "mm", before.radialDepthMm, after.radialDepthMm);
  return parts.join(", ");
}

/** True when the cut itself changes (what was proven no longer describes it). */
function cutChanged(before: RecipeState, after: RecipeState): boolean {
  return (
    before.assemblyId !== after.assemblyId ||
    before.materialId !== after.materialId ||
    before.operation !== after.operation ||
    !sameJson(before.params, after.params)
  );
}

export interface RecipeChange {
  name?: string | undefined;
  assemblyId?: string | undefined;
  materialId?: string | undefined;
  operation?: RecipeState["operation"] | undefined;
  params?: RecipeParams | undefined;
  notes?: string | undefined;
}

/**
 * Writes a new revision with `change` applied and the result recomputed. Editing the cut of a
 * proven or approved recipe sends it back to trial (it has not been proven in its new form); the
 * transition is stored with a comment saying why. A change that alters nothing writes nothing.
 */
export async function reviseRecipe(shopId: string, id: string, change: RecipeChange, changeNote: string, actor: Actor, tx: Tx): Promise<{ changed: boolean }> {
  const current = await lockRecipe(shopId, id, tx);
  if (!current) throw notFound();
  if (current.status === "retired") {
    throw AppError.conflict("A retired recipe cannot be edited. Reinstate it as a draft first.");
  }
  const { machineName: _m, ...next } = await computeState(
    shopId,
    {
      name: change.name ?? current.name,
      assemblyId: change.assemblyId ?? current.assemblyId,
      materialId: change.materialId ?? current.materialId,
      operation: change.operation ?? current.operation,
      params: change.params ?? current.params,
      notes: change.notes ?? current.notes,
    },
    tx,
    { refuseRetiredCutter: change.assemblyId !== undefined && change.assemblyId !== current.assemblyId },
  );
  const anything = cutChanged(current, next) || current.name !== next.name || current.notes !== next.notes || !sameJson(current.result, next.result);
  if (!anything) {
    // Re-checked against the current library and nothing moved: the flag the library sets clears.
    await clearNeedsRecheck(shopId, id, tx);
    return { changed: false };
  }
  const revision = current.revision + 1;
  const settled = current.status === "proven" || current.status === "approved";
  const moved = numbersMoved(current.result, next.result);
  await updateRecipeState(shopId, id, { ...next, revision }, tx);
  await insertRevision(shopId, id, revision, next, changeNote, actor.userId, tx);
  if (settled && (cutChanged(current, next) || moved)) {
    const comment = cutChanged(current, next)
      ? `Revision ${revision} changed the cut of this ${current.status} recipe: it is back on trial until it is proven again.`
      : `Revision ${revision} recomputed this ${current.status} recipe against the current library and its numbers moved (${moved}): it is back on trial until it is proven again.`;
    await insertTransition(shopId, id, current.status, "trial", comment, actor.userId, tx);
    await setRecipeStatus(shopId, id, "trial", comment, tx);
  }
  const backToTrial = settled && (cutChanged(current, next) || moved !== "");
  await recordAuditEvent(tx, {
    shopId,
    actor,
    action: "recipe.revised",
    subject: recipeSubject({ id, name: next.name }),
    detail: { revision, note: changeNote, ...(backToTrial ? { statusFrom: current.status, statusTo: "trial" } : {}) },
  });
  return { changed: true };
}

export async function updateRecipe(shopId: string, id: string, body: RecipeChange & { changeNote: string }, actor: Actor): Promise<Recipe> {
  const { changeNote, ...change } = body;
  await inTransaction((tx) => reviseRecipe(shopId, id, change, changeNote || "Edited", actor, tx));
  return (await findRecipe(shopId, id))!;
}

// ---------------------------------------------------------------- revisions

const PARAM_LABELS: Record<keyof RecipeParams, { label: string; unit: string }> = {
  axialDepthMm: { label: "axial depth", unit: "mm" },
  radialDepthMm: { label: "radial depth", unit: "mm" },
  workPositionXMm: { label: "work position X", unit: "mm" },
  workPositionYMm: { label: "work position Y", unit: "mm" },
  workRegion: { label: "work region", unit: "mm" },
  millingDirection: { label: "milling direction", unit: "" },
  rpmOverride: { label: "chosen spindle speed", unit: "rpm" },
  chipLoadOverrideMm: { label: "chosen chip load", unit: "mm" },
};

const show = (v: unknown, unit: string): string => (v === null || v === undefined ? "engine's choice" : unit ? `${String(v)} ${unit}` : String(v));

/** A work region in words ("none" when the work position alone is used; older revisions have no field). */
const showRegion = (r: RecipeParams["workRegion"] | undefined): string =>
  r ? `X ${r.xMinMm}–${r.xMaxMm} mm, Y ${r.yMinMm}–${r.yMaxMm} mm` : "none (the work position)";

/** What changed from one revision to the next, in words. */
export function describeChanges(before: RevisionRecord, after: RevisionRecord): string[] {
  const out: string[] = [];
  if (before.name !== after.name) out.push(`name “${before.name}” → “${after.name}”`);
  if (before.assemblyId !== after.assemblyId) out.push(`assembly ${before.assemblyLabel} → ${after.assemblyLabel}`);
  if (before.materialId !== after.materialId) out.push(`material ${before.materialName} → ${after.materialName}`);
  if (before.operation !== after.operation) out.push(`operation ${before.operation} → ${after.operation}`);
  for (const key of Object.keys(PARAM_LABELS) as Array<keyof RecipeParams>) {
    if (key === "workRegion") {
      const a = showRegion(before.params.workRegion);
      const b = showRegion(after.params.workRegion);
      if (a !== b) out.push(`work region ${a} → ${b}`);
      continue;
    }
    const a = before.params[key];
    const b = after.params[key];
    if (a !== b) out.push(`${PARAM_LABELS[key].label} ${show(a, PARAM_LABELS[key].unit)} → ${show(b, PARAM_LABELS[key].unit)}`);
  }
  if (before.notes !== after.notes) out.push("notes edited");
  if (out.length === 0 && !sameJson(before.result, after.result)) out.push("recomputed against the current library");
  return out;
}

export function toRevisionResponses(records: RevisionRecord[]): RecipeRevision[] {
  return records
    .map((r, i) => {
      const prev = i > 0 ? records[i - 1] : undefined;
      const { assemblyLabel: _a, materialName: _m, ...rest } = r;
      return { ...rest, changes: prev ? describeChanges(prev, r) : [] };
    })
    .reverse();
}

export async function recipeRevisions(shopId: string, id: string, actor: Actor): Promise<{ items: RecipeRevision[] }> {
  await visibleRecipe(shopId, id, actor);
  return { items: toRevisionResponses(await listRevisions(shopId, id)) };
}

export async function restoreRevision(shopId: string, id: string, revision: number, note: string, actor: Actor): Promise<Recipe> {
  await inTransaction(async (tx) => {
    const old = await findRevision(shopId, id, revision, tx);
    if (!(await lockRecipe(shopId, id, tx))) throw notFound();
    if (!old) throw AppError.validation("That revision does not exist.", { revision: `This recipe has no revision ${revision}.` });
    const { changed } = await reviseRecipe(
      shopId,
      id,
      { name: old.name, assemblyId: old.assemblyId, materialId: old.materialId, operation: old.operation, params: old.params, notes: old.notes },
      `Restored revision ${revision}${note ? `: ${note}` : ""}`,
      actor,
      tx,
    );
    if (!changed) throw AppError.conflict(`The recipe already matches revision ${revision}; nothing to restore.`);
  });
  return (await findRecipe(shopId, id))!;
}

// ---------------------------------------------------------------- life cycle

interface TransitionRule {
  /** Least role allowed. */
  role: Role;
  needsComment?: string;
}

const RULES: Partial<Record<RecipeStatus, Partial<Record<RecipeStatus, TransitionRule>>>> = {
  draft: { trial: { role: "programmer" }, retired: { role: "tooling_manager" } },
  trial: { draft: { role: "programmer" }, proven: { role: "programmer" }, retired: { role: "tooling_manager" } },
  proven: {
    approved: { role: "tooling_manager" },
    trial: { role: "programmer", needsComment: "Say why it goes back to trial." },
    retired: { role: "tooling_manager" },
  },
  approved: {
    trial: { role: "tooling_manager", needsComment: "Say why it goes back to trial." },
    retired: { role: "tooling_manager" },
  },
  retired: { draft: { role: "tooling_manager" } },
};

const LIFE = "draft → trial → proven on its machine → approved, and retired at any point";

export async function transitionRecipe(shopId: string, id: string, to: RecipeStatus, comment: string, actor: Actor): Promise<Recipe> {
  await inTransaction(async (tx) => {
    const current = await lockRecipe(shopId, id, tx);
    if (!current || !canSeeStatus(actor.role, current.status)) throw notFound();
    if (current.status === to) throw AppError.conflict(`The recipe is already ${to}.`);
    const rule = RULES[current.status]?.[to];
    if (!rule) {
      const subject = withArticle(current.status);
      throw AppError.conflict(`${subject.charAt(0).toUpperCase()}${subject.slice(1)} recipe cannot become ${to} (${LIFE}).`, { to: `Not possible from ${current.status}.` });
    }
    if (!roleAtLeast(actor.role, rule.role)) {
      throw AppError.forbidden(
        rule.role === "tooling_manager"
          ? `Only a tooling manager or owner can make ${withArticle(current.status)} recipe ${to}.`
          : `Only a programmer, tooling manager or owner can make ${withArticle(current.status)} recipe ${to}.`,
      );
    }
    if (rule.needsComment && comment.trim() === "") throw AppError.validation("A comment is required.", { comment: rule.needsComment });
    if (to === "proven" && (await countCleanCutsOnMachine(shopId, id, current.machineId, tx)) === 0) {
      throw AppError.conflict("Log at least one clean cut of this recipe on its machine before marking it proven.");
    }
    if (to === "approved") {
      const records = await findAssemblyRecords(shopId, current.assemblyId, tx);
      if (!records) throw AppError.conflict("The recipe's assembly, machine or cutter has been deleted: it cannot be approved.");
      if (records.cutter.status !== "approved") {
        throw AppError.conflict(`The cutter ${records.cutter.name} is ${records.cutter.status}, not approved: approve the cutter before the recipe.`);
      }
    }
    await insertTransition(shopId, id, current.status, to, comment, actor.userId, tx);
    await setRecipeStatus(shopId, id, to, comment || null, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "recipe.status_changed",
      subject: recipeSubject({ id, name: current.name }),
      detail: { from: current.status, to, comment: comment || undefined },
    });
  });
  return (await findRecipe(shopId, id))!;
}

export async function recipeTransitions(shopId: string, id: string, actor: Actor): Promise<{ items: RecipeTransition[] }> {
  await visibleRecipe(shopId, id, actor);
  return { items: await listTransitions(shopId, id) };
}

// ---------------------------------------------------------------- delete, copy

/** Programmers may bin drafts and trials; proven, approved and retired recipes need a tooling manager or owner. */
function requireDeleteRight(status: RecipeStatus, actor: Actor): void {
  const least: Role = status === "draft" || status === "trial" ? "programmer" : "tooling_manager";
  if (!roleAtLeast(actor.role, least)) {
    throw AppError.forbidden(
      least === "programmer"
        ? "Only a programmer, tooling manager or owner can delete recipes."
        : `Only a tooling manager or owner can delete ${withArticle(status)} recipe.`,
    );
  }
}

export async function deleteRecipe(shopId: string, id: string, actor: Actor): Promise<void> {
  await inTransaction(async (tx) => {
    const current = await lockRecipe(shopId, id, tx);
    if (!current) throw notFound();
    requireDeleteRight(current.status, actor);
    await setRecipeDeleted(shopId, id, new Date(), tx);
    await recordAuditEvent(tx, { shopId, actor, action: "recipe.deleted", subject: recipeSubject({ id, name: current.name }), detail: { status: current.status } });
  });
}

export async function restoreDeletedRecipe(shopId: string, id: string, actor: Actor): Promise<Recipe> {
  await inTransaction(async (tx) => {
    const current = await lockRecipe(shopId, id, tx, { deleted: true });
    if (!current) {
      if (await findRecipe(shopId, id, { tx })) throw AppError.conflict("This recipe is not deleted.");
      throw notFound();
    }
    requireDeleteRight(current.status, actor);
    await setRecipeDeleted(shopId, id, null, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "recipe.restored", subject: recipeSubject({ id, name: current.name }), detail: { status: current.status } });
  });
  return (await findRecipe(shopId, id))!;
}

export async function copyRecipe(shopId: string, id: string, target: { assemblyId: string; name?: string | undefined }, actor: Actor): Promise<Recipe> {
  const source = await visibleRecipe(shopId, id, actor);
  const newId = await inTransaction(async (tx) => {
    const { machineName, ...computed } = await computeState(
      shopId,
      { ...source, assemblyId: target.assemblyId },
      tx,
      { refuseRetiredCutter: true },
    );
    const state = { ...computed, name: target.name ?? `${source.name} (${machineName})`.slice(0, 160) };
    const recipeId = await insertRecipe(shopId, state, actor.userId, tx);
    await insertRevision(
      shopId,
      recipeId,
      1,
      state,
      `Copied from “${source.name}” revision ${source.revision} (${source.machineName}); recomputed for ${machineName}, not yet proven there`,
      actor.userId,
      tx,
    );
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "recipe.copied",
      subject: recipeSubject({ id: recipeId, name: state.name }),
      detail: { fromId: source.id, fromName: source.name, fromRevision: source.revision, machine: machineName },
    });
    return recipeId;
  });
  return (await findRecipe(shopId, newId))!;
}
