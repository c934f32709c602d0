import type { Request, RequestHandler, Router } from "express";
import multer from "multer";
import { acceptDialRpmBodySchema, acceptModeBodySchema, RECORDING_LIMITS, recordingListQuerySchema, recordingUploadFieldsSchema } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { currentShop, currentUser } from "../../http/locals.js";
import { fieldErrors, inputOf, nulCharacterFields, validate } from "../../http/validate.js";
import type { Storage } from "../../storage/storage.js";
import { requireShopRole } from "../shops/require-shop-role.js";
import { requestActor } from "../audit/audit-actor.js";
import { idParam } from "../vibration/ids.js";
import {
  acceptDialRpm,
  acceptMode,
  deleteRecording,
  machineRecordings,
  recordingDetail,
  recordingFile,
  uploadRecording,
  type UploadedRecordingFile,
} from "./recordings.service.js";

export interface RecordingRouteDeps {
  storage: Storage;
}

const MB = 1024 * 1024;

/** multer in memory (nothing touches the disk before the file is checked), its errors as the API's. */
function multipart(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: RECORDING_LIMITS.maxBytes, files: 1, fields: 10, fieldSize: 4 * 1024, parts: 12 },
  }).single("file");
  return (req, res, next) => {
    if (!req.is("multipart/form-data")) {
      next(AppError.validation("Upload the recording as multipart/form-data with the file in the field “file”.", { file: "Attach a WAV or CSV file" }));
      return;
    }
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        switch (err.code) {
          case "LIMIT_FILE_SIZE":
            return next(
              new AppError("payload_too_large", `The recording is larger than ${RECORDING_LIMITS.maxBytes / MB} MB.`, {
                fields: { file: `At most ${RECORDING_LIMITS.maxBytes / MB} MB` },
              }),
            );
          case "LIMIT_FILE_COUNT":
          case "LIMIT_UNEXPECTED_FILE":
            return next(AppError.validation("Attach one recording, in the form field “file”.", { file: "One file, in the field “file”" }));
          default:
            return next(AppError.validation(`The upload was not accepted: ${err.message}.`));
        }
      }
      // Anything else is a body the multipart parser could not read (cut short, no boundary…).
      next(AppError.validation("The upload could not be read: send the recording as a complete multipart/form-data body.", { file: "The upload could not be read" }));
    });
  };
}

function fileOf(req: Request): UploadedRecordingFile | undefined {
  const f = req.file;
  // multer reads the name as latin1; browsers send UTF-8.
  return f ? { originalName: Buffer.from(f.originalname, "latin1").toString("utf8"), bytes: f.buffer } : undefined;
}

const listInput = { query: recordingListQuerySchema };
const acceptModeInput = { body: acceptModeBodySchema };
const acceptDialInput = { body: acceptDialRpmBodySchema };

/**
 * /api/shops/:shopId/machines/:machineId/recordings (every member lists, reads and uploads: a
 * recording changes no limit by itself; owners and tooling managers delete) and
 * /api/shops/:shopId/recordings/:id/accept-mode | accept-dial-rpm (owners and tooling managers:
 * they change the machine).
 */
export function registerRecordingRoutes(router: Router, deps: RecordingRouteDeps): void {
  const manager = requireShopRole("tooling_manager");
  const upload = multipart();
  const base = "/machines/:machineId/recordings";

  router.get(base, validate(listInput), async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await machineRecordings(currentShop(res).shop.id, machineId, inputOf(res, listInput).query.kind));
  });

  router.post(base, upload, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    const nul = nulCharacterFields(req.body ?? {}, []);
    if (Object.keys(nul).length > 0) throw AppError.validation("Some fields need attention.", nul);
    const parsed = recordingUploadFieldsSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw AppError.validation("Some fields need attention.", fieldErrors(parsed.error));
    const recording = await uploadRecording(currentShop(res).shop.id, machineId, parsed.data, fileOf(req), { ...requestActor(res), userId: currentUser(res).id }, deps.storage);
    res.status(202).location(`${req.baseUrl}${base.replace(":machineId", machineId)}/${recording.id}`).json({ recording });
  });

  router.get(`${base}/:recordingId`, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    res.json(await recordingDetail(currentShop(res).shop.id, machineId, idParam(req.params.recordingId, "Recording")));
  });

  router.get(`${base}/:recordingId/file`, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    const file = await recordingFile(currentShop(res).shop.id, machineId, idParam(req.params.recordingId, "Recording"), deps.storage);
    res.setHeader("Content-Type", file.contentType);
    res.setHeader("Content-Length", String(file.sizeBytes));
    res.setHeader("Content-Disposition", `attachment; filename="${file.fileName}"`);
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.setHeader("Cache-Control", "private, max-age=86400, immutable");
    file.stream.on("error", (error) => res.destroy(error));
    file.stream.pipe(res);
  });

  router.delete(`${base}/:recordingId`, manager, async (req, res) => {
    const machineId = idParam(req.params.machineId, "Machine");
    await deleteRecording(currentShop(res).shop.id, machineId, idParam(req.params.recordingId, "Recording"), deps.storage, requestActor(res));
    res.status(204).end();
  });

  router.post("/recordings/:recordingId/accept-mode", manager, validate(acceptModeInput), async (req, res) => {
    const id = idParam(req.params.recordingId, "Recording");
    res.status(201).json(await acceptMode(currentShop(res).shop.id, id, inputOf(res, acceptModeInput).body, requestActor(res)));
  });

  router.post("/recordings/:recordingId/accept-dial-rpm", manager, validate(acceptDialInput), async (req, res) => {
    const id = idParam(req.params.recordingId, "Recording");
    res.json(await acceptDialRpm(currentShop(res).shop.id, id, inputOf(res, acceptDialInput).body.dialSetting, requestActor(res)));
  });
}
