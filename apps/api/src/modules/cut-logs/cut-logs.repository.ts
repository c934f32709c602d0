/** Cut logs and their photo records; every query is filtered by the shop. */
import { QueryTypes } from "sequelize";
import { cutLogSchema, type CutLog, type CutLogBody, type CutLogListQuery, type RecipeStatus } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { CutLogModel, CutLogPhotoModel } from "./cut-log.model.js";

type Row = Record<string, unknown>;

async function select(sql: string, replacements: Record<string, unknown>, tx?: Tx | null): Promise<Row[]> {
  return getSequelize().query<Row>(sql, { replacements, type: QueryTypes.SELECT, transaction: tx ?? null });
}

const iso = (v: unknown): string => (v instanceof Date ? v : new Date(String(v))).toISOString();

export const photoUrl = (shopId: string, cutLogId: string, photoId: string): string =>
  `/api/shops/${shopId}/cut-logs/${cutLogId}/photos/${photoId}`;

const COLUMNS = `
  l.*, u.name AS user_name, r.name AS recipe_name, r.cutter_id, r.operation, c.name AS cutter_name,
  COALESCE((SELECT json_agg(json_build_object('id', p.id, 'contentType', p.content_type, 'sizeBytes', p.size_bytes) ORDER BY p.created_at, p.id)
              FROM cut_log_photos p WHERE p.cut_log_id = l.id), '[]') AS photos`;
const JOINS = `
  JOIN users u ON u.id = l.user_id
  JOIN recipes r ON r.id = l.recipe_id
  JOIN cutters c ON c.id = r.cutter_id`;

function toCutLog(r: Row): CutLog {
  const shopId = String(r.shop_id);
  const id = String(r.id);
  return cutLogSchema.parse({
    id,
    recipeId: r.recipe_id,
    recipeRevision: r.recipe_revision,
    machineId: r.machine_id,
    materialId: r.material_id,
    userId: r.user_id,
    userName: r.user_name,
    outcome: r.outcome,
    actualRpm: r.actual_rpm,
    actualFeedMmPerMin: r.actual_feed_mm_per_min,
    axialDepthMm: r.axial_depth_mm,
    radialDepthMm: r.radial_depth_mm,
    feedOverridePct: r.feed_override_pct,
    note: r.note,
    photos: (r.photos as Array<{ id: string; contentType: string; sizeBytes: number }>).map((p) => ({
      id: p.id,
      url: photoUrl(shopId, id, p.id),
      contentType: p.contentType,
      sizeBytes: p.sizeBytes,
    })),
    createdAt: iso(r.created_at),
    recipeName: r.recipe_name,
    cutterId: r.cutter_id,
    cutterName: r.cutter_name,
    operation: r.operation,
  });
}

export async function insertCutLog(
  shopId: string,
  recipe: { id: string; revision: number; machineId: string; materialId: string },
  userId: string,
  body: CutLogBody,
  tx: Tx,
): Promise<string> {
  const row = await CutLogModel.create(
    {
      shopId,
      recipeId: recipe.id,
      recipeRevision: recipe.revision,
      machineId: recipe.machineId,
      materialId: recipe.materialId,
      userId,
      outcome: body.outcome,
      actualRpm: body.actualRpm,
      actualFeedMmPerMin: body.actualFeedMmPerMin,
      axialDepthMm: body.axialDepthMm,
      radialDepthMm: body.radialDepthMm,
      feedOverridePct: body.feedOverridePct,
      note: body.note,
    },
    { transaction: tx },
  );
  return row.id;
}

/** Replaces the recorded numbers of a cut log (a re-scored ladder rung). */
export async function updateCutLog(shopId: string, id: string, body: CutLogBody, tx: Tx): Promise<void> {
  await CutLogModel.update(
    {
      outcome: body.outcome,
      actualRpm: body.actualRpm,
      actualFeedMmPerMin: body.actualFeedMmPerMin,
      axialDepthMm: body.axialDepthMm,
      radialDepthMm: body.radialDepthMm,
      feedOverridePct: body.feedOverridePct,
      note: body.note,
    },
    { where: { shopId, id }, transaction: tx },
  );
}

export async function insertPhoto(
  shopId: string,
  cutLogId: string,
  photo: { id: string; storageKey: string; contentType: string; sizeBytes: number },
  tx: Tx,
): Promise<void> {
  await CutLogPhotoModel.create({ shopId, cutLogId, ...photo }, { transaction: tx });
}

export async function findCutLog(shopId: string, id: string, tx?: Tx): Promise<CutLog | null> {
  const rows = await select(`SELECT ${COLUMNS} FROM cut_logs l ${JOINS} WHERE l.shop_id = :shopId AND l.id = :id`, { shopId, id }, tx);
  return rows[0] ? toCutLog(rows[0]) : null;
}

/** A page of a recipe's cut logs, newest first. */
export async function listRecipeCutLogs(shopId: string, recipeId: string, page: { page: number; pageSize: number }): Promise<{ items: CutLog[]; total: number }> {
  const replacements = { shopId, recipeId, limit: page.pageSize, offset: (page.page - 1) * page.pageSize };
  const [rows, count] = await Promise.all([
    select(`SELECT ${COLUMNS} FROM cut_logs l ${JOINS} WHERE l.shop_id = :shopId AND l.recipe_id = :recipeId ORDER BY l.created_at DESC, l.id DESC LIMIT :limit OFFSET :offset`, replacements),
    select(`SELECT count(*) AS total FROM cut_logs l WHERE l.shop_id = :shopId AND l.recipe_id = :recipeId`, replacements),
  ]);
  return { items: rows.map(toCutLog), total: Number(count[0]?.total ?? 0) };
}

/**
 * A page of the shop's cut logs (planner evidence), newest first, optionally by machine, material,
 * cutter and outcome, and limited to recipes in `statuses` (for operators). Logs of deleted recipes are left out.
 */
export async function listShopCutLogs(shopId: string, query: CutLogListQuery, statuses: RecipeStatus[] | null): Promise<{ items: CutLog[]; total: number }> {
  const parts = ["l.shop_id = :shopId", "r.deleted_at IS NULL"];
  const replacements: Record<string, unknown> = { shopId, limit: query.pageSize, offset: (query.page - 1) * query.pageSize };
  if (query.machineId) {
    parts.push("l.machine_id = :machineId");
    replacements.machineId = query.machineId;
  }
  if (query.materialId) {
    parts.push("l.material_id = :materialId");
    replacements.materialId = query.materialId;
  }
  if (query.cutterId) {
    parts.push("r.cutter_id = :cutterId");
    replacements.cutterId = query.cutterId;
  }
  if (query.outcome) {
    parts.push("l.outcome = :outcome");
    replacements.outcome = query.outcome;
  }
  if (statuses) {
    parts.push("r.status IN (:statuses)");
    replacements.statuses = statuses;
  }
  const where = parts.join(" AND ");
  const [rows, count] = await Promise.all([
    select(`SELECT ${COLUMNS} FROM cut_logs l ${JOINS} WHERE ${where} ORDER BY l.created_at DESC, l.id DESC LIMIT :limit OFFSET :offset`, replacements),
    select(`SELECT count(*) AS total FROM cut_logs l JOIN recipes r ON r.id = l.recipe_id WHERE ${where}`, replacements),
  ]);
  return { items: rows.map(toCutLog), total: Number(count[0]?.total ?? 0) };
}

/** Every cut log of the shop, oldest first (export). */
export async function listAllCutLogs(shopId: string): Promise<CutLog[]> {
  const rows = await select(`SELECT ${COLUMNS} FROM cut_logs l ${JOINS} WHERE l.shop_id = :shopId ORDER BY l.created_at, l.id`, { shopId });
  return rows.map(toCutLog);
}

export interface PhotoRecord {
  id: string;
  cutLogId: string;
  recipeId: string;
  recipeStatus: RecipeStatus;
  recipeDeleted: boolean;
  storageKey: string;
  contentType: string;
  sizeBytes: number;
}

export async function findPhoto(shopId: string, cutLogId: string, photoId: string): Promise<PhotoRecord | null> {
  const rows = await select(
    `SELECT p.*, l.recipe_id, r.status AS recipe_status, r.deleted_at AS recipe_deleted_at
       FROM cut_log_photos p JOIN cut_logs l ON l.id = p.cut_log_id JOIN recipes r ON r.id = l.recipe_id
      WHERE p.shop_id = :shopId AND p.cut_log_id = :cutLogId AND p.id = :photoId`,
    { shopId, cutLogId, photoId },
  );
  const r = rows[0];
  if (!r) return null;
  return {
    id: String(r.id),
    cutLogId: String(r.cut_log_id),
    recipeId: String(r.recipe_id),
    recipeStatus: r.recipe_status as RecipeStatus,
    recipeDeleted: r.recipe_deleted_at !== null,
    storageKey: String(r.storage_key),
    contentType: String(r.content_type),
    sizeBytes: Number(r.size_bytes),
  };
}
