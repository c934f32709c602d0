import type { RequestHandler, Router } from "express";
import multer from "multer";
import {
  cutterCreateBodySchema,
  cutterExportQuerySchema,
  cutterImportQuerySchema,
  cutterListQuerySchema,
  cutterPatchBodySchema,
  cutterTransitionBodySchema,
  recordIdSchema,
  type ApiError,
} from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop } from "../../http/locals.js";
import { inputOf, validate } from "../../http/validate.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { MAX_CSV_BYTES } from "./cutters-csv.js";
import {
  createCutter,
  deleteCutter,
  exportCutters,
  getCutter,
  importCutters,
  importRefusal,
  listShopCutters,
  patchCutter,
  restoreCutter,
  transitionCutter,
} from "./cutters.service.js";

const listInput = { query: cutterListQuerySchema };
const createInput = { body: cutterCreateBodySchema };
const patchInput = { body: cutterPatchBodySchema };
const transitionInput = { body: cutterTransitionBodySchema };
const exportInput = { query: cutterExportQuerySchema };
const importInput = { query: cutterImportQuerySchema };

function cutterId(raw: unknown): string {
  const parsed = recordIdSchema.safeParse(raw);
  if (!parsed.success) throw AppError.notFound("Cutter not found.");
  return parsed.data;
}

// What browsers and spreadsheet programs send for a .csv file.
const CSV_TYPES = new Set(["text/csv", "application/csv", "text/x-csv", "application/vnd.ms-excel", "text/plain"]);

/** Reads the one `file` part into memory (size-limited) and turns multer's errors into ours. */
const csvUpload: RequestHandler = (req, res, next) => {
  if (!req.is("multipart/form-data")) {
    next(new AppError("unsupported_media_type", "Upload the CSV file as multipart/form-data in a field named “file”."));
    return;
  }
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_CSV_BYTES, files: 1, fields: 10 } });
  upload.single("file")(req, res, (err: unknown) => {
    if (!err) {
      next();
      return;
    }
    const code = (err as { code?: string }).code;
    if (code === "LIMIT_FILE_SIZE") {
      next(new AppError("payload_too_large", `The file is larger than ${MAX_CSV_BYTES / 1024 / 1024} MiB; split the list.`));
    } else if (code === "LIMIT_UNEXPECTED_FILE" || code === "LIMIT_FILE_COUNT") {
      next(AppError.validation("Send exactly one file, in a field named “file”.", { file: "Send one CSV file" }));
    } else {
      next(AppError.validation("The upload could not be read. Try again.", { file: "The upload could not be read" }));
    }
  });
};

function csvFileOf(file: Express.Multer.File | undefined): Buffer {
  if (!file) throw AppError.validation("Choose a CSV file to upload.", { file: "Choose a CSV file" });
  const type = file.mimetype.toLowerCase();
  const namedCsv = /\.csv$/i.test(file.originalname);
  if (!CSV_TYPES.has(type) && !(type === "application/octet-stream" && namedCsv)) {
    throw new AppError("unsupported_media_type", `Upload a .csv file (this one is ${file.mimetype}).`);
  }
  return file.buffer;
}

/**
 * /api/shops/:shopId/cutters — every member reads and exports; programmers propose and edit
 * proposals and create cutters as proposed; tooling managers and owners approve, retire, import
 * and edit any cutter.
 */
export function registerCutterRoutes(router: Router): void {
  const programmer = requireShopRole("programmer");
  const manager = requireShopRole("tooling_manager");

  router.get("/cutters", validate(listInput), async (_req, res) => {
    res.json(await listShopCutters(currentShop(res).shop.id, inputOf(res, listInput).query));
  });

  router.post("/cutters", programmer, validate(createInput), async (_req, res) => {
    const { shop, membership } = currentShop(res);
    res.status(201).json(await createCutter(shop.id, membership.role, inputOf(res, createInput).body, requestActor(res)));
  });

  // Fixed paths before /cutters/:cutterId.
  router.get("/cutters/export", validate(exportInput), async (_req, res) => {
    const { shop } = currentShop(res);
    const query = inputOf(res, exportInput).query;
    const csv = await exportCutters(shop.id, query);
    const day = new Date().toISOString().slice(0, 10);
    const unitsSuffix = query.units === "imperial" ? "-inch" : "";
    res.setHeader("Content-Type", "text/csv; charset=utf-8");
    res.setHeader("Content-Disposition", `attachment; filename="cutters-${day}${unitsSuffix}.csv"`);
    res.send(csv);
  });

  router.post("/cutters/import", manager, validate(importInput), csvUpload, async (req, res) => {
    const { dryRun } = inputOf(res, importInput).query;
    const { ok, report } = await importCutters(currentShop(res).shop.id, csvFileOf(req.file), dryRun, requestActor(res), req.file ? Buffer.from(req.file.originalname, "latin1").toString("utf8") : "");
    if (ok) {
      res.status(dryRun ? 200 : 201).json(report);
      return;
    }
    if (dryRun) {
      res.status(200).json(report);
      return;
    }
    const error: ApiError["error"] = { code: "validation_failed", message: importRefusal(report) };
    res.status(400).json({ error, report });
  });

  router.get("/cutters/:cutterId", async (req, res) => {
    res.json(await getCutter(currentShop(res).shop.id, cutterId(req.params.cutterId)));
  });

  router.patch("/cutters/:cutterId", programmer, validate(patchInput), async (req, res) => {
    const { shop, membership } = currentShop(res);
    res.json(await patchCutter(shop.id, membership.role, cutterId(req.params.cutterId), inputOf(res, patchInput).body, requestActor(res)));
  });

  router.delete("/cutters/:cutterId", programmer, async (req, res) => {
    const { shop, membership } = currentShop(res);
    await deleteCutter(shop.id, membership.role, cutterId(req.params.cutterId), requestActor(res));
    res.status(204).end();
  });

  router.post("/cutters/:cutterId/restore", programmer, async (req, res) => {
    const { shop, membership } = currentShop(res);
    res.json(await restoreCutter(shop.id, membership.role, cutterId(req.params.cutterId), requestActor(res)));
  });

  router.post("/cutters/:cutterId/transition", manager, validate(transitionInput), async (req, res) => {
    const id = cutterId(req.params.cutterId);
    res.json(await transitionCutter(currentShop(res).shop.id, id, inputOf(res, transitionInput).body.to, requestActor(res)));
  });
}
