import type { Request, RequestHandler, Response, Router } from "express";
import multer from "multer";
import { z } from "zod";
import { CUT_LOG_MAX_PHOTOS, cutLogBodySchema, cutLogListQuerySchema, paginationQuerySchema, type CutLogBody } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { inputOf, validate, fieldErrors, nulCharacterFields } from "../../http/validate.js";
import type { Storage } from "../../storage/storage.js";
import { recipeIdOf, shopAndActor } from "../recipes/recipes.router.js";
import { createCutLog, cutLogPhoto, recipeCutLogs, shopCutLogs, type UploadedPhoto } from "./cut-logs.service.js";

export interface CutLogRouteDeps {
  storage: Storage;
  /** Largest photo accepted [bytes]. */
  photoMaxBytes: number;
}

const uuid = z.string().uuid();
const idOf = (value: unknown, what: string): string => {
  const parsed = uuid.safeParse(value);
  if (!parsed.success) throw AppError.notFound(`${what} not found.`);
  return parsed.data;
};

const megabytes = (bytes: number): string => `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;

/** Runs multer and turns its errors into the API's errors (nothing is written to disk: memory storage). */
function multipart(photoMaxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: photoMaxBytes, files: CUT_LOG_MAX_PHOTOS, fields: 5, fieldSize: 64 * 1024, parts: CUT_LOG_MAX_PHOTOS + 5 },
  }).array("photos", CUT_LOG_MAX_PHOTOS);
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        switch (err.code) {
          case "LIMIT_FILE_SIZE":
            return next(new AppError("payload_too_large", `Each photo must be at most ${megabytes(photoMaxBytes)}.`, { fields: { photos: `At most ${megabytes(photoMaxBytes)} per photo` } }));
          case "LIMIT_FILE_COUNT":
          case "LIMIT_UNEXPECTED_FILE":
            return next(
              AppError.validation(`Attach at most ${CUT_LOG_MAX_PHOTOS} photos, in the field “photos”.`, { photos: `At most ${CUT_LOG_MAX_PHOTOS} photos` }),
            );
          default:
            return next(AppError.validation(`The upload was not accepted: ${err.message}.`));
        }
      }
      // Anything else is a body the multipart parser could not read (cut short, no boundary…).
      next(AppError.validation("The upload could not be read: send the cut log as a complete multipart/form-data body."));
    });
  };
}

/** The cut log body from JSON, or from the multipart field `data` (JSON text). */
function bodyOf(req: Request): CutLogBody {
  let raw: unknown = req.body;
  if (req.is("multipart/form-data")) {
    const data = (req.body as Record<string, unknown> | undefined)?.data;
    if (typeof data !== "string") throw AppError.validation("Send the cut log as JSON text in the form field “data”.", { data: "Required" });
    try {
      raw = JSON.parse(data);
    } catch {
      throw AppError.validation("The form field “data” is not valid JSON.", { data: "Not valid JSON" });
    }
  }
  const nul = nulCharacterFields(raw, []);
  if (Object.keys(nul).length > 0) throw AppError.validation("Some fields need attention.", nul);
  const parsed = cutLogBodySchema.safeParse(raw ?? {});
  if (!parsed.success) throw AppError.validation("Some fields need attention.", fieldErrors(parsed.error));
  return parsed.data;
}

function photosOf(req: Request): UploadedPhoto[] {
  const files = (req.files as Express.Multer.File[] | undefined) ?? [];
  return files.map((f) => ({ originalName: f.originalname, bytes: f.buffer }));
}

const pageInput = { query: paginationQuerySchema };
const listInput = { query: cutLogListQuerySchema };

/**
 * /api/shops/:shopId/recipes/:recipeId/cut-logs (read and post: every member; operators on approved
 * recipes and recipes on trial), /cut-logs (shop-wide evidence) and /cut-logs/:cutLogId/photos/:photoId.
 */
export function registerCutLogRoutes(router: Router, deps: CutLogRouteDeps): void {
  const upload = multipart(deps.photoMaxBytes);
  const maybeUpload: RequestHandler = (req, res, next) => (req.is("multipart/form-data") ? upload(req, res, next) : next());

  router.get("/recipes/:recipeId/cut-logs", validate(pageInput), async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await recipeCutLogs(shopId, recipeIdOf(req), inputOf(res, pageInput).query, actor));
  });

  router.post("/recipes/:recipeId/cut-logs", maybeUpload, async (req, res) => {
    const { shopId, actor } = shopAndActor(res);
    const recipeId = recipeIdOf(req);
    res.status(201).json(await createCutLog(shopId, recipeId, bodyOf(req), photosOf(req), actor, deps.storage));
  });

  router.get("/cut-logs", validate(listInput), async (_req, res) => {
    const { shopId, actor } = shopAndActor(res);
    res.json(await shopCutLogs(shopId, inputOf(res, listInput).query, actor));
  });

  router.get("/cut-logs/:cutLogId/photos/:photoId", async (req, res: Response) => {
    const { shopId, actor } = shopAndActor(res);
    const photo = await cutLogPhoto(shopId, idOf(req.params.cutLogId, "Photo"), idOf(req.params.photoId, "Photo"), actor, deps.storage);
    res.setHeader("Content-Type", photo.contentType);
    res.setHeader("Content-Length", String(photo.sizeBytes));
    res.setHeader("Content-Disposition", `inline; filename="${photo.fileName}"`);
    res.setHeader("X-Content-Type-Options", "nosniff");
    // Photos never change under their id; the browser may keep them (privately) for a day.
    res.setHeader("Cache-Control", "private, max-age=86400, immutable");
    photo.stream.on("error", (error) => res.destroy(error));
    photo.stream.pipe(res);
  });
}
