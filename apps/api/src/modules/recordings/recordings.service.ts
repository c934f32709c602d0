import { randomUUID } from "node:crypto";
import type { z } from "zod";
import type {
  AcceptDialRpmResponse,
  AcceptModeResponse,
  RecordingDetail,
  RecordingKind,
  RecordingList,
  RecordingSummary,
  acceptModeBodySchema,
  recordingUploadFieldsSchema,
} from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { enqueueAnalysis, jobQueue } from "../../jobs/job-queue.js";
import type { Storage, StoredObject } from "../../storage/storage.js";
import { updateMachine } from "../machines/machines.repository.js";
import { addModeInTx } from "../modes/modes.service.js";
import { findMode } from "../modes/modes.repository.js";
import { machineForRead, machineForUpdate } from "../vibration/machine-access.js";
import { inspectRecording, RecordingFileError } from "./recording-decoder.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import {
  deleteRecordingRow,
  findRecording,
  insertRecording,
  listRecordings,
  publicSummary,
  updateRecording,
} from "./recordings.repository.js";

export interface UploadedRecordingFile {
  originalName: string;
  bytes: Buffer;
}

type UploadFields = z.output<typeof recordingUploadFieldsSchema>;

const EXTENSION = { wav: "wav", csv_series: "csv", csv_frf: "csv" } as const;
const CONTENT_TYPE = { wav: "audio/wav", csv_series: "text/csv", csv_frf: "text/csv" } as const;

/** The file name as shown: no path, no control characters, at most 255 characters. */
function displayName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, "").trim();
  return (clean || "recording").slice(0, 255);
}

/**
 * Checks the file by its content and the fields against the machine, stores the file, then writes
 * the recording (queued) and its analysis job in one transaction. If anything after storing fails,
 * the file is removed again: a failed upload leaves neither a row nor a file behind.
 */
export async function uploadRecording(
  shopId: string,
  machineId: string,
  fields: UploadFields,
  file: UploadedRecordingFile | undefined,
  actor: AuditActor & { userId: string },
  storage: Storage,
): Promise<RecordingSummary> {
  const machine = await machineForRead(shopId, machineId);
  if (machine.deletedAt) throw AppError.conflict("This machine is deleted; restore it before adding recordings.");
  if (!file) throw AppError.validation("Attach the recording in the form field “file”.", { file: "Attach a WAV or CSV file" });
  // Before any work: without a running queue the upload could not be analysed.
  jobQueue();

  let info;
  try {
    info = inspectRecording(file.bytes);
  } catch (error) {
    if (error instanceof RecordingFileError) {
      if (error.kind === "unsupported") throw new AppError("unsupported_media_type", error.message, { fields: { file: error.message } });
      throw AppError.validation(error.message, { file: error.message });
    }
    throw error;
  }
  const series = info.format !== "csv_frf";
  if (fields.kind === "frf" && series) {
    throw AppError.validation("A frequency-response upload must be a CSV with the columns frequency_hz,real,imag.", { file: "Expected frequency_hz,real,imag" });
  }
  if (fields.kind !== "frf" && !series) {
    throw AppError.validation("This file is a frequency response; choose the kind “frequency response”, or upload a time signal.", { kind: "The file is a frequency response" });
  }
  if (fields.kind === "spindle_free" && fields.dialSetting !== undefined && !machine.spindle.dialSettings.some((d) => d.label === fields.dialSetting)) {
    const labels = machine.spindle.dialSettings.map((d) => d.label).join(", ");
    throw AppError.validation("Unknown dial setting.", {
      dialSetting: labels ? `This machine's dial settings are ${labels}` : "This machine has no dial settings; give the nominal rpm instead",
    });
  }

  const id = randomUUID();
  const storageKey = `shops/${shopId}/recordings/${id}.${EXTENSION[info.format]}`;
  await storage.put(storageKey, file.bytes, CONTENT_TYPE[info.format]);
  try {
    const created = await inTransaction(async (tx) => {
      const row = await insertRecording(
        {
          id,
          shopId,
          machineId,
          kind: fields.kind,
          format: info.format,
          storageKey,
          originalName: displayName(file.originalName),
          sizeBytes: file.bytes.length,
          sampleRateHz: info.sampleRateHz,
          durationS: info.durationS,
          channels: info.channels,
          rpm: fields.rpm ?? null,
          flutes: fields.flutes ?? null,
          direction: fields.direction ?? null,
          dialSetting: fields.dialSetting ?? null,
          note: fields.note ?? "",
          createdBy: actor.userId,
        },
        tx,
      );
      await enqueueAnalysis({ recordingId: id }, tx);
      await recordAuditEvent(tx, {
        shopId,
        actor,
        action: "recording.uploaded",
        subject: recordingSubject(machine.name, row),
        detail: { machineId, kind: row.kind, format: row.format, sizeBytes: row.sizeBytes },
      });
      return row;
    });
    return publicSummary(created);
  } catch (error) {
    await storage.delete(storageKey).catch(() => undefined);
    throw error;
  }
}

/** How a recording is named in the audit log. */
function recordingSubject(machineName: string, r: { id: string; originalName: string }) {
  return { type: "recording" as const, id: r.id, label: `${machineName}: ${r.originalName}` };
}

export async function machineRecordings(shopId: string, machineId: string, kind: RecordingKind | undefined): Promise<RecordingList> {
  await machineForRead(shopId, machineId);
  return { items: (await listRecordings(shopId, machineId, kind)).map(publicSummary) };
}

async function recordingOfMachine(shopId: string, machineId: string, id: string) {
  const recording = await findRecording(shopId, id);
  if (!recording || recording.machineId !== machineId) throw AppError.notFound("Recording not found.");
  return recording;
}

export async function recordingDetail(shopId: string, machineId: string, id: string): Promise<RecordingDetail> {
  await machineForRead(shopId, machineId);
  const { results, ...summary } = await recordingOfMachine(shopId, machineId, id);
  return { ...publicSummary(summary), results };
}

export async function recordingFile(
  shopId: string,
  machineId: string,
  id: string,
  storage: Storage,
): Promise<StoredObject & { contentType: string; fileName: string }> {
  await machineForRead(shopId, machineId);
  const recording = await recordingOfMachine(shopId, machineId, id);
  const stored = await storage.get(recording.storageKey);
  if (!stored) throw AppError.notFound("The recording's file is missing.");
  return { ...stored, contentType: CONTENT_TYPE[recording.format], fileName: recording.originalName.replace(/["\\]/g, "_") };
}

/** Deletes the recording and its file; modes accepted from it stay (they lose the link). */
export async function deleteRecording(shopId: string, machineId: string, id: string, storage: Storage, actor: AuditActor): Promise<void> {
  const key = await inTransaction(async (tx) => {
    const machine = await machineForRead(shopId, machineId, tx);
    const recording = await findRecording(shopId, id, tx, true);
    if (!recording || recording.machineId !== machineId) throw AppError.notFound("Recording not found.");
    await deleteRecordingRow(shopId, id, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "recording.deleted",
      subject: recordingSubject(machine.name, recording),
      detail: { machineId, kind: recording.kind },
    });
    return recording.storageKey;
  });
  // A worker that already picked the job up finds no row and stops.
  await storage.delete(key);
}

/**
 * Adds the mode proposed by a finished tap test (source measured) or frequency-response fit
 * (source fitted) to the machine's modes, then applies the re-check rule.
 */
export async function acceptMode(shopId: string, id: string, body: z.output<typeof acceptModeBodySchema>, actor: AuditActor): Promise<AcceptModeResponse> {
  return inTransaction(async (tx) => {
    const recording = await findRecording(shopId, id, tx, true);
    if (!recording) throw AppError.notFound("Recording not found.");
    if (recording.kind !== "tap" && recording.kind !== "frf") {
      throw AppError.conflict("Only a tap test or a frequency response proposes a mode.");
    }
    if (recording.status !== "done" || !recording.results || (recording.results.kind !== "tap" && recording.results.kind !== "frf")) {
      throw AppError.conflict(recording.status === "failed" ? "The analysis failed, so there is no mode to accept." : "The analysis has not finished yet.");
    }
    if (recording.acceptedModeId && (await findMode(shopId, recording.machineId, recording.acceptedModeId, tx))) {
      throw AppError.conflict("The mode from this recording is already among the machine's modes.");
    }
    const machine = await machineForUpdate(shopId, recording.machineId, tx);
    const proposed = recording.results.proposedMode;
    if (proposed.stiffnessNPerMm === null) {
      throw AppError.conflict("No stiffness is known in that direction; add dial-indicator readings first.");
    }
    const direction = body.direction ?? proposed.direction;
    const when = new Date(recording.createdAt).toISOString().slice(0, 10);
    const outcome = await addModeInTx(
      shopId,
      recording.machineId,
      {
        direction,
        frequencyHz: proposed.frequencyHz,
        dampingRatio: proposed.dampingRatio,
        stiffnessNPerMm: proposed.stiffnessNPerMm,
        source: proposed.source,
        note: body.note ?? `${recording.kind === "tap" ? "Tap test" : "Frequency response"} “${recording.originalName}” of ${when}`.slice(0, 500),
        massKg: null,
        recordingId: recording.id,
        measuredAt: new Date(recording.createdAt),
      },
      tx,
    );
    await updateRecording(recording.id, { acceptedModeId: outcome.mode.id }, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "recording.mode_accepted",
      subject: recordingSubject(machine.name, recording),
      detail: {
        machineId: machine.id,
        modeId: outcome.mode.id,
        direction: outcome.mode.direction,
        frequencyHz: outcome.mode.frequencyHz,
        dampingRatio: outcome.mode.dampingRatio,
        stiffnessNPerMm: outcome.mode.stiffnessNPerMm,
      },
    });
    const { results: _r, ...summary } = recording;
    return { ...outcome, recording: { ...publicSummary(summary), acceptedModeId: outcome.mode.id } };
  });
}

/** Sets a dial setting's rpm to the speed measured with the spindle running free, and marks it measured. */
export async function acceptDialRpm(shopId: string, id: string, dialSetting: string | undefined, actor: AuditActor): Promise<AcceptDialRpmResponse> {
  return inTransaction(async (tx) => {
    const recording = await findRecording(shopId, id, tx, true);
    if (!recording) throw AppError.notFound("Recording not found.");
    if (recording.kind !== "spindle_free") throw AppError.conflict("Only a recording of the spindle running free measures a dial setting.");
    if (recording.status !== "done" || recording.results?.kind !== "spindle_free") throw AppError.conflict("The analysis has not finished yet.");
    const label = dialSetting ?? recording.dialSetting;
    if (!label) throw AppError.validation("Choose the dial setting to update.", { dialSetting: "Choose a dial setting" });
    const machine = await machineForUpdate(shopId, recording.machineId, tx);
    const index = machine.spindle.dialSettings.findIndex((d) => d.label === label);
    if (index < 0) throw AppError.validation("Unknown dial setting.", { dialSetting: `This machine has no dial setting “${label}”` });
    const previousRpm = machine.spindle.dialSettings[index]!.rpm;
    const rpm = Math.round(recording.results.measuredRpm);
    const dialSettings = machine.spindle.dialSettings.map((d, i) => (i === index ? { ...d, rpm, measured: true } : d));
    const field = `spindle.dialSettings.${index}`;
    await updateMachine(
      shopId,
      machine.id,
      { spindle: { ...machine.spindle, dialSettings }, estimatedFields: machine.estimatedFields.filter((f) => f !== field && f !== `${field}.rpm`) },
      tx,
    );
    await updateRecording(recording.id, { dialRpmApplied: true }, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "recording.dial_rpm_accepted",
      subject: recordingSubject(machine.name, recording),
      detail: { machineId: machine.id, dialSetting: label, previousRpm, rpm },
    });
    const { results: _r, ...summary } = recording;
    return { recording: { ...publicSummary(summary), dialRpmApplied: true }, dialSetting: { label, rpm, measured: true, previousRpm } };
  });
}
