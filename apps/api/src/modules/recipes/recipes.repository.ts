/**
 * Recipes, their revisions and their status transitions. Every query is filtered by the shop.
 * Reads join the library tables for names and return contract-shaped plain objects.
 */
import { Op, QueryTypes } from "sequelize";
import {
  recipeListItemSchema,
  recipeSchema,
  type Operation,
  type Recipe,
  type RecipeListItem,
  type RecipeListQuery,
  type RecipeParams,
  type RecipeResultSummary,
  type RecipeStatus,
} from "@ringdown/contracts";
import { preparedSelect } from "../../db/prepared.js";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { RecipeModel, RecipeRevisionModel, RecipeTransitionModel } from "./recipe.model.js";

/** Stored params in today's shape: revisions saved before the work region existed have none. */
export function storedParams(raw: unknown): RecipeParams {
  const params = raw as RecipeParams;
  return { ...params, workRegion: params.workRegion ?? null };
}

type Row = Record<string, unknown>;

async function select(sql: string, replacements: Record<string, unknown>, tx?: Tx | null): Promise<Row[]> {
  return getSequelize().query<Row>(sql, { replacements, type: QueryTypes.SELECT, transaction: tx ?? null });
}

const iso = (v: unknown): string => (v instanceof Date ? v : new Date(String(v))).toISOString();

const RECIPE_COLUMNS = `
  r.*, u.name AS author_name, m.name AS machine_name, c.name AS cutter_name, mat.name AS material_name,
  (SELECT count(*) FROM cut_logs cl WHERE cl.recipe_id = r.id) AS cut_log_count`;
const RECIPE_JOINS = `
  JOIN users u ON u.id = r.author_id
  JOIN machines m ON m.id = r.machine_id
  JOIN cutters c ON c.id = r.cutter_id
  JOIN materials mat ON mat.id = r.material_id`;

/** The fields a full recipe and a list row share, from a row of RECIPE_COLUMNS or LIST_COLUMNS. */
function commonFields(r: Row) {
  return {
    id: r.id,
    shopId: r.shop_id,
    name: r.name,
    assemblyId: r.assembly_id,
    machineId: r.machine_id,
    cutterId: r.cutter_id,
    materialId: r.material_id,
    operation: r.operation,
    status: r.status,
    revision: r.revision,
    notes: r.notes,
    needsRecheck: r.needs_recheck,
    authorId: r.author_id,
    authorName: r.author_name,
    machineName: r.machine_name,
    cutterName: r.cutter_name,
    materialName: r.material_name,
    lastComment: r.last_comment,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    deletedAt: r.deleted_at ? iso(r.deleted_at) : null,
    cutLogCount: Number(r.cut_log_count ?? 0),
  };
}

function toRecipe(r: Row): Recipe {
  return recipeSchema.parse({ ...commonFields(r), params: storedParams(r.params), result: r.result });
}

/** What a row of the list needs (recipeListItemSchema): the headline numbers out of the stored result. */
const LIST_COLUMNS = `
  r.id, r.shop_id, r.name, r.assembly_id, r.machine_id, r.cutter_id, r.material_id, r.operation, r.status,
  r.revision, r.notes, r.needs_recheck, r.author_id, r.last_comment, r.created_at, r.updated_at, r.deleted_at,
  r.rpm, r.feed_mm_per_min, (r.result->>'chipLoadMm')::float8 AS chip_load_mm,
  (r.result->>'materialRemovalRateMm3PerMin')::float8 AS removal_rate_mm3_per_min,
  (r.result->>'powerW')::float8 AS power_w, (r.result->>'stable')::boolean AS stable,
  u.name AS author_name, m.name AS machine_name, c.name AS cutter_name, mat.name AS material_name,
  (SELECT count(*) FROM cut_logs cl WHERE cl.recipe_id = r.id) AS cut_log_count`;

function toListItem(r: Row): RecipeListItem {
  return recipeListItemSchema.parse({
    ...commonFields(r),
    result: {
      rpm: r.rpm,
      feedMmPerMin: r.feed_mm_per_min,
      chipLoadMm: r.chip_load_mm,
      materialRemovalRateMm3PerMin: r.removal_rate_mm3_per_min,
      powerW: r.power_w,
      stable: r.stable,
    },
  });
}

/** One recipe of the shop (deleted ones only when asked), or null. */
export async function findRecipe(shopId: string, id: string, options: { deleted?: boolean; tx?: Tx } = {}): Promise<Recipe | null> {
  const deleted = options.deleted ? "r.deleted_at IS NOT NULL" : "r.deleted_at IS NULL";
  const rows = await select(
    `SELECT ${RECIPE_COLUMNS} FROM recipes r ${RECIPE_JOINS} WHERE r.shop_id = :shopId AND r.id = :id AND ${deleted}`,
    { shopId, id },
    options.tx,
  );
  return rows[0] ? toRecipe(rows[0]) : null;
}

/** Every recipe of the shop with its deleted ones (export). */
export async function listAllRecipes(shopId: string): Promise<Recipe[]> {
  const rows = await select(`SELECT ${RECIPE_COLUMNS} FROM recipes r ${RECIPE_JOINS} WHERE r.shop_id = :shopId ORDER BY r.created_at, r.id`, { shopId });
  return rows.map(toRecipe);
}

const STATUS_ORDER = "CASE r.status WHEN 'draft' THEN 0 WHEN 'trial' THEN 1 WHEN 'proven' THEN 2 WHEN 'approved' THEN 3 ELSE 4 END";

/** Sort key per sortable field and the one library join it needs (names). */
const SORT_SQL: Record<RecipeListQuery["sort"], { key: string; join: string }> = {
  name: { key: "r.name", join: "" },
  updatedAt: { key: "r.updated_at", join: "" },
  // Life-cycle order, not alphabetical (matches the expression index of migration 0010).
  status: { key: STATUS_ORDER, join: "" },
  rpm: { key: "r.rpm", join: "" },
  feedMmPerMin: { key: "r.feed_mm_per_min", join: "" },
  machineName: { key: "m.name", join: "JOIN machines m ON m.id = r.machine_id" },
  materialName: { key: "mat.name", join: "JOIN materials mat ON mat.id = r.material_id" },
  cutterName: { key: "c.name", join: "JOIN cutters c ON c.id = r.cutter_id" },
};

/** `%`, `_` and `\` match literally in a free-text search. */
function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}

/** The WHERE clause of a list query and its replacements (shared by the page and the count). */
function listWhere(shopId: string, query: RecipeListQuery, approvedOnly: boolean): { sql: string; replacements: Record<string, unknown> } {
  const life = query.deleted ? "deleted_at IS NOT NULL" : "deleted_at IS NULL";
  const parts = ["r.shop_id = :shopId", `r.${life}`];
  const replacements: Record<string, unknown> = { shopId };
  if (approvedOnly) parts.push("r.status = 'approved'");
  if (query.status) {
    parts.push("r.status = :status");
    replacements.status = query.status;
  }
  if (query.machineId) {
    parts.push("r.machine_id = :machineId");
    replacements.machineId = query.machineId;
  }
  if (query.materialId) {
    parts.push("r.material_id = :materialId");
    replacements.materialId = query.materialId;
  }
  if (query.cutterId) {
    parts.push("r.cutter_id = :cutterId");
    replacements.cutterId = query.cutterId;
  }
  if (query.operation) {
    parts.push("r.operation = :operation");
    replacements.operation = query.operation;
  }
  if (query.q) {
    // One arm per field, each served by an index of this shop's rows (migration 0042's trigram
    // indexes on name and notes; the shop's few matching machines, cutters and materials looked up
    // first, then their recipes through the filter indexes). One OR over all five would make the
    // planner read every recipe of the shop.
    const ofShop = `SELECT id FROM recipes WHERE shop_id = :shopId AND ${life}`;
    parts.push(`r.id IN (
      ${ofShop} AND name ILIKE :q
      UNION ${ofShop} AND notes ILIKE :q
      UNION ${ofShop} AND machine_id IN (SELECT id FROM machines WHERE shop_id = :shopId AND name ILIKE :q)
      UNION ${ofShop} AND cutter_id IN (SELECT id FROM cutters WHERE shop_id = :shopId AND name ILIKE :q)
      UNION ${ofShop} AND material_id IN (SELECT id FROM materials WHERE (shop_id = :shopId OR shop_id IS NULL) AND name ILIKE :q))`);
    replacements.q = likePattern(query.q);
  }
  return { sql: parts.join(" AND "), replacements };
}

/**
 * The list query's SQL (exported so a test can EXPLAIN exactly what the route runs). The page of
 * ids is found first from the recipes table (plus the one library table a name sort needs), which
 * the list indexes of migration 0010 serve in order or cover outright; the names and counts are
 * then joined for those rows only. Every row of `page` also carries the total (`list_total`,
 * counted once), so a list takes one round trip; `count` is for a page past the end, which has no
 * rows to carry it.
 */
export function recipeListSql(shopId: string, query: RecipeListQuery, approvedOnly: boolean): { page: string; count: string; replacements: Record<string, unknown> } {
  const where = listWhere(shopId, query, approvedOnly);
  const sort = SORT_SQL[query.sort];
  const dir = query.order === "asc" ? "ASC" : "DESC";
  const replacements = { ...where.replacements, limit: query.pageSize, offset: (query.page - 1) * query.pageSize };
  const count = `SELECT count(*) AS total FROM recipes r WHERE ${where.sql}`;
  const page = `SELECT ${LIST_COLUMNS}, (${count}) AS list_total
    FROM (SELECT r.id, ${sort.key} AS sort_key FROM recipes r ${sort.join}
           WHERE ${where.sql} ORDER BY ${sort.key} ${dir}, r.id ${dir} LIMIT :limit OFFSET :offset) AS page
    JOIN recipes r ON r.id = page.id ${RECIPE_JOINS}
    ORDER BY page.sort_key ${dir}, r.id ${dir}`;
  return { page, count, replacements };
}

export async function listRecipes(shopId: string, query: RecipeListQuery, approvedOnly: boolean): Promise<{ items: RecipeListItem[]; total: number }> {
  const sql = recipeListSql(shopId, query, approvedOnly);
  const rows = await preparedSelect(sql.page, sql.replacements);
  const total = rows.length ? rows[0]!.list_total : (await preparedSelect<{ total: number }>(sql.count, sql.replacements))[0]?.total;
  return { items: rows.map(toListItem), total: Number(total ?? 0) };
}

/** The fields a recipe row and a revision row share. */
export interface RecipeState {
  name: string;
  assemblyId: string;
  machineId: string;
  cutterId: string;
  materialId: string;
  operation: Operation;
  params: RecipeParams;
  result: RecipeResultSummary;
  notes: string;
}

export async function insertRecipe(shopId: string, state: RecipeState, authorId: string, tx: Tx): Promise<string> {
  const row = await RecipeModel.create(
    { shopId, ...state, rpm: state.result.rpm, feedMmPerMin: state.result.feedMmPerMin, authorId, status: "draft", revision: 1 },
    { transaction: tx },
  );
  return row.id;
}

/** The current row, locked for this transaction (serialises revision numbers), or null. */
export async function lockRecipe(
  shopId: string,
  id: string,
  tx: Tx,
  options: { deleted?: boolean } = {},
): Promise<(RecipeState & { status: RecipeStatus; revision: number }) | null> {
  const row = await RecipeModel.findOne({
    where: { shopId, id, deletedAt: options.deleted ? { [Op.ne]: null } : null },
    transaction: tx,
    lock: tx.LOCK.UPDATE,
  });
  if (!row) return null;
  return {
    name: row.name,
    assemblyId: row.assemblyId,
    machineId: row.machineId,
    cutterId: row.cutterId,
    materialId: row.materialId,
    operation: row.operation,
    params: storedParams(row.params),
    result: row.result,
    notes: row.notes,
    status: row.status,
    revision: row.revision,
  };
}

export async function updateRecipeState(shopId: string, id: string, state: RecipeState & { revision: number; status?: RecipeStatus; lastComment?: string | null }, tx: Tx): Promise<void> {
  await RecipeModel.update(
    { ...state, rpm: state.result.rpm, feedMmPerMin: state.result.feedMmPerMin, needsRecheck: false },
    { where: { shopId, id }, transaction: tx },
  );
}

export async function clearNeedsRecheck(shopId: string, id: string, tx: Tx): Promise<void> {
  await RecipeModel.update({ needsRecheck: false }, { where: { shopId, id, needsRecheck: true }, transaction: tx, silent: true });
}

export async function setRecipeStatus(shopId: string, id: string, status: RecipeStatus, lastComment: string | null, tx: Tx): Promise<void> {
  await RecipeModel.update({ status, lastComment }, { where: { shopId, id }, transaction: tx });
}

export async function setRecipeDeleted(shopId: string, id: string, deletedAt: Date | null, tx: Tx): Promise<void> {
  await RecipeModel.update({ deletedAt }, { where: { shopId, id }, transaction: tx });
}

// ---------------------------------------------------------------- revisions

export async function insertRevision(
  shopId: string,
  recipeId: string,
  revision: number,
  state: RecipeState,
  changeNote: string,
  authorId: string,
  tx: Tx,
): Promise<void> {
  await RecipeRevisionModel.create(
    {
      shopId,
      recipeId,
      revision,
      name: state.name,
      assemblyId: state.assemblyId,
      materialId: state.materialId,
      operation: state.operation,
      params: state.params,
      result: state.result,
      notes: state.notes,
      changeNote,
      authorId,
    },
    { transaction: tx },
  );
}

export interface RevisionRecord {
  id: string;
  recipeId: string;
  revision: number;
  name: string;
  assemblyId: string;
  materialId: string;
  operation: Operation;
  params: RecipeParams;
  result: RecipeResultSummary;
  notes: string;
  changeNote: string;
  authorId: string;
  authorName: string;
  createdAt: string;
  /** "cutter in holder on machine", for change descriptions. */
  assemblyLabel: string;
  materialName: string;
}

function toRevision(r: Row): RevisionRecord {
  return {
    id: String(r.id),
    recipeId: String(r.recipe_id),
    revision: Number(r.revision),
    name: String(r.name),
    assemblyId: String(r.assembly_id),
    materialId: String(r.material_id),
    operation: r.operation as Operation,
    params: storedParams(r.params),
    result: r.result as RecipeResultSummary,
    notes: String(r.notes),
    changeNote: String(r.change_note),
    authorId: String(r.author_id),
    authorName: String(r.author_name),
    createdAt: iso(r.created_at),
    assemblyLabel: r.cutter_name ? `${String(r.cutter_name)} in ${String(r.holder)} on ${String(r.machine_name)}` : "a deleted assembly",
    materialName: r.material_name ? String(r.material_name) : "a deleted material",
  };
}

const REVISION_SQL = `
  SELECT v.*, u.name AS author_name, a.holder, c.name AS cutter_name, m.name AS machine_name, mat.name AS material_name
    FROM recipe_revisions v
    JOIN users u ON u.id = v.author_id
    LEFT JOIN assemblies a ON a.id = v.assembly_id AND a.shop_id = v.shop_id
    LEFT JOIN cutters c ON c.id = a.cutter_id
    LEFT JOIN machines m ON m.id = a.machine_id
    LEFT JOIN materials mat ON mat.id = v.material_id`;

/** Every revision of a recipe, oldest first. */
export async function listRevisions(shopId: string, recipeId: string): Promise<RevisionRecord[]> {
  const rows = await select(`${REVISION_SQL} WHERE v.shop_id = :shopId AND v.recipe_id = :recipeId ORDER BY v.revision`, { shopId, recipeId });
  return rows.map(toRevision);
}

/** Every revision of every recipe of the shop (export), oldest first per recipe. */
export async function listShopRevisions(shopId: string): Promise<RevisionRecord[]> {
  const rows = await select(`${REVISION_SQL} WHERE v.shop_id = :shopId ORDER BY v.recipe_id, v.revision`, { shopId });
  return rows.map(toRevision);
}

export async function findRevision(shopId: string, recipeId: string, revision: number, tx?: Tx): Promise<RevisionRecord | null> {
  const rows = await select(`${REVISION_SQL} WHERE v.shop_id = :shopId AND v.recipe_id = :recipeId AND v.revision = :revision`, { shopId, recipeId, revision }, tx);
  return rows[0] ? toRevision(rows[0]) : null;
}

// ---------------------------------------------------------------- transitions

export async function insertTransition(
  shopId: string,
  recipeId: string,
  from: RecipeStatus,
  to: RecipeStatus,
  comment: string,
  actorId: string,
  tx: Tx,
): Promise<void> {
  await RecipeTransitionModel.create({ shopId, recipeId, fromStatus: from, toStatus: to, comment, actorId }, { transaction: tx });
}

export interface TransitionRecord {
  id: string;
  recipeId: string;
  from: RecipeStatus;
  to: RecipeStatus;
  comment: string;
  actorId: string;
  actorName: string;
  createdAt: string;
}

const TRANSITION_SQL = `
  SELECT t.*, u.name AS actor_name FROM recipe_transitions t JOIN users u ON u.id = t.actor_id`;

function toTransition(r: Row): TransitionRecord {
  return {
    id: String(r.id),
    recipeId: String(r.recipe_id),
    from: r.from_status as RecipeStatus,
    to: r.to_status as RecipeStatus,
    comment: String(r.comment),
    actorId: String(r.actor_id),
    actorName: String(r.actor_name),
    createdAt: iso(r.created_at),
  };
}

/** Status changes of a recipe, newest first. */
export async function listTransitions(shopId: string, recipeId: string): Promise<TransitionRecord[]> {
  const rows = await select(`${TRANSITION_SQL} WHERE t.shop_id = :shopId AND t.recipe_id = :recipeId ORDER BY t.created_at DESC, t.id DESC`, { shopId, recipeId });
  return rows.map(toTransition);
}

export async function listShopTransitions(shopId: string): Promise<TransitionRecord[]> {
  const rows = await select(`${TRANSITION_SQL} WHERE t.shop_id = :shopId ORDER BY t.recipe_id, t.created_at, t.id`, { shopId });
  return rows.map(toTransition);
}

/** Clean cuts of this recipe logged on `machineId` (what "proven on this machine" needs). */
export async function countCleanCutsOnMachine(shopId: string, recipeId: string, machineId: string, tx: Tx): Promise<number> {
  const rows = await select(
    `SELECT count(*) AS n FROM cut_logs WHERE shop_id = :shopId AND recipe_id = :recipeId AND machine_id = :machineId AND outcome = 'clean'`,
    { shopId, recipeId, machineId },
    tx,
  );
  return Number(rows[0]?.n ?? 0);
}
