/**
 * The cut log: every member records how a cut went, with optional photos. A post is all or
 * nothing: the log row, its photo rows and the stored files are written together, and anything
 * stored before a failure is removed again.
 */
import { randomUUID } from "node:crypto";
import type { CutLog, CutLogBody, CutLogListQuery, CutLogPage, PaginationQuery, Recipe, RecipeStatus, Role } from "@ringdown/contracts";
import { CUT_LOG_MAX_PHOTOS } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { inTransaction } from "../../db/sequelize.js";
import type { Storage, StoredObject } from "../../storage/storage.js";
import { findRecipe } from "../recipes/recipes.repository.js";
import { findCutLog, findPhoto, insertCutLog, insertPhoto, listRecipeCutLogs, listShopCutLogs } from "./cut-logs.repository.js";
import { PHOTO_TYPES, sniffPhotoType } from "./photo-type.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";

/** The caller: their role decides what they may see; the rest names them in the audit log. */
export interface Actor extends AuditActor {
  userId: string;
  role: Role;
}

/**
 * Statuses whose cut logs an operator reads and writes: approved recipes (what they run) and
 * recipes on trial (the test cuts they make on the floor).
 */
export const OPERATOR_LOG_STATUSES: RecipeStatus[] = ["approved", "trial"];

export function canLogOn(role: Role, status: RecipeStatus): boolean {
  return role !== "operator" || OPERATOR_LOG_STATUSES.includes(status);
}

/** The recipe whose log the actor may read or write, or 404. */
export async function recipeForLogging(shopId: string, recipeId: string, actor: Actor): Promise<Recipe> {
  const recipe = await findRecipe(shopId, recipeId);
  if (!recipe || !canLogOn(actor.role, recipe.status)) throw AppError.notFound("Recipe not found.");
  return recipe;
}

/** An uploaded file as the route received it. */
export interface UploadedPhoto {
  originalName: string;
  bytes: Buffer;
}

/** Checks every photo's type from its bytes before anything is written. */
function checkPhotos(photos: UploadedPhoto[]): Array<UploadedPhoto & { contentType: keyof typeof PHOTO_TYPES }> {
  if (photos.length > CUT_LOG_MAX_PHOTOS) {
    throw AppError.validation(`Attach at most ${CUT_LOG_MAX_PHOTOS} photos.`, { photos: `At most ${CUT_LOG_MAX_PHOTOS} photos` });
  }
  return photos.map((p, i) => {
    const contentType = sniffPhotoType(p.bytes);
    if (!contentType) {
      throw new AppError("unsupported_media_type", `${p.originalName || `Photo ${i + 1}`} is not a JPEG, PNG or WebP image.`, {
        fields: { photos: "Photos must be JPEG, PNG or WebP images" },
      });
    }
    return { ...p, contentType };
  });
}

/**
 * Records a cut of `recipeId` with its photos. Files are stored inside the database transaction;
 * if anything fails, the transaction rolls back and every file already stored is deleted.
 */
export async function createCutLog(
  shopId: string,
  recipeId: string,
  body: CutLogBody,
  photos: UploadedPhoto[],
  actor: Actor,
  storage: Storage,
): Promise<CutLog> {
  const checked = checkPhotos(photos);
  const recipe = await recipeForLogging(shopId, recipeId, actor);
  const stored: string[] = [];
  let id: string;
  try {
    id = await inTransaction(async (tx) => {
      const logId = await insertCutLog(shopId, recipe, actor.userId, body, tx);
      for (const photo of checked) {
        const photoId = randomUUID();
        const storageKey = `shops/${shopId}/cut-logs/${logId}/${photoId}.${PHOTO_TYPES[photo.contentType]}`;
        await storage.put(storageKey, photo.bytes, photo.contentType);
        stored.push(storageKey);
        await insertPhoto(shopId, logId, { id: photoId, storageKey, contentType: photo.contentType, sizeBytes: photo.bytes.length }, tx);
      }
      await recordAuditEvent(tx, {
        shopId,
        actor,
        action: "cut_log.created",
        subject: { type: "cut_log", id: logId, label: `${recipe.name}, revision ${recipe.revision}` },
        detail: { recipeId: recipe.id, outcome: body.outcome, photos: checked.length },
      });
      return logId;
    });
  } catch (error) {
    await Promise.all(stored.map((key) => storage.delete(key).catch(() => undefined)));
    throw error;
  }
  return (await findCutLog(shopId, id))!;
}

export async function recipeCutLogs(shopId: string, recipeId: string, page: PaginationQuery, actor: Actor): Promise<CutLogPage> {
  await recipeForLogging(shopId, recipeId, actor);
  const { items, total } = await listRecipeCutLogs(shopId, recipeId, page);
  return { items, total, page: page.page, pageSize: page.pageSize };
}

export async function shopCutLogs(shopId: string, query: CutLogListQuery, actor: Actor): Promise<CutLogPage> {
  const { items, total } = await listShopCutLogs(shopId, query, actor.role === "operator" ? OPERATOR_LOG_STATUSES : null);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** A photo's bytes and type, for a member who may see its recipe's log. */
export async function cutLogPhoto(
  shopId: string,
  cutLogId: string,
  photoId: string,
  actor: Actor,
  storage: Storage,
): Promise<StoredObject & { contentType: string; fileName: string }> {
  const photo = await findPhoto(shopId, cutLogId, photoId);
  if (!photo || photo.recipeDeleted || !canLogOn(actor.role, photo.recipeStatus)) throw AppError.notFound("Photo not found.");
  const object = await storage.get(photo.storageKey);
  if (!object) throw AppError.notFound("The photo's file is missing from storage.");
  const ext = photo.storageKey.slice(photo.storageKey.lastIndexOf(".") + 1);
  return { ...object, contentType: photo.contentType, fileName: `cut-log-${cutLogId.slice(0, 8)}-${photoId.slice(0, 8)}.${ext}` };
}
