import { Op } from "sequelize";
import type { RecordingKind, RecordingResults, RecordingStatus, RecordingSummary } from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import { RecordingModel } from "./recording.model.js";

const SUMMARY_ATTRIBUTES = [
  "id",
  "shopId",
  "machineId",
  "kind",
  "format",
  "storageKey",
  "originalName",
  "sizeBytes",
  "sampleRateHz",
  "durationS",
  "channels",
  "rpm",
  "flutes",
  "direction",
  "dialSetting",
  "note",
  "status",
  "progress",
  "failureReason",
  "attempts",
  "acceptedModeId",
  "dialRpmApplied",
  "createdBy",
  "createdAt",
  "updatedAt",
  "startedAt",
  "analysedAt",
] as const;

export interface StoredRecording extends RecordingSummary {
  shopId: string;
  storageKey: string;
  attempts: number;
}

const toSummary = (r: RecordingModel): StoredRecording => ({
  id: r.id,
  shopId: r.shopId,
  machineId: r.machineId,
  kind: r.kind,
  format: r.format,
  storageKey: r.storageKey,
  originalName: r.originalName,
  sizeBytes: r.sizeBytes,
  sampleRateHz: r.sampleRateHz,
  durationS: r.durationS,
  channels: r.channels,
  rpm: r.rpm,
  flutes: r.flutes,
  direction: r.direction,
  dialSetting: r.dialSetting,
  note: r.note,
  status: r.status,
  progress: r.progress,
  failureReason: r.failureReason,
  attempts: r.attempts,
  acceptedModeId: r.acceptedModeId,
  dialRpmApplied: r.dialRpmApplied,
  createdAt: r.createdAt.toISOString(),
  updatedAt: r.updatedAt.toISOString(),
  analysedAt: r.analysedAt ? r.analysedAt.toISOString() : null,
});

/** The public shape: no storage key, no attempt counter. */
export function publicSummary(r: StoredRecording): RecordingSummary {
  const { shopId: _s, storageKey: _k, attempts: _a, ...summary } = r;
  return summary;
}

export async function listRecordings(shopId: string, machineId: string, kind?: RecordingKind): Promise<StoredRecording[]> {
  const rows = await RecordingModel.findAll({
    attributes: [...SUMMARY_ATTRIBUTES],
    where: { shopId, machineId, ...(kind ? { kind } : {}) },
    order: [
      ["createdAt", "DESC"],
      ["id", "ASC"],
    ],
  });
  return rows.map(toSummary);
}

export async function findRecording(shopId: string, id: string, tx?: Tx, lock = false): Promise<(StoredRecording & { results: RecordingResults | null }) | null> {
  const row = await RecordingModel.findOne({
    where: { id, shopId },
    transaction: tx ?? null,
    ...(tx && lock ? { lock: tx.LOCK.UPDATE } : {}),
  });
  return row ? { ...toSummary(row), results: row.results ?? null } : null;
}

/** For the worker: the recording by id alone (jobs carry no shop). */
export async function findRecordingForJob(id: string): Promise<StoredRecording | null> {
  const row = await RecordingModel.findOne({ attributes: [...SUMMARY_ATTRIBUTES], where: { id } });
  return row ? toSummary(row) : null;
}

export type NewRecording = Pick<
  StoredRecording,
  | "id"
  | "shopId"
  | "machineId"
  | "kind"
  | "format"
  | "storageKey"
  | "originalName"
  | "sizeBytes"
  | "sampleRateHz"
  | "durationS"
  | "channels"
  | "rpm"
  | "flutes"
  | "direction"
  | "dialSetting"
  | "note"
> & { createdBy: string | null };

export async function insertRecording(recording: NewRecording, tx: Tx): Promise<StoredRecording> {
  const row = await RecordingModel.create(recording, { transaction: tx });
  return toSummary(row);
}

export async function deleteRecordingRow(shopId: string, id: string, tx: Tx): Promise<void> {
  await RecordingModel.destroy({ where: { shopId, id }, transaction: tx });
}

export async function updateRecording(
  id: string,
  changes: Partial<{
    status: RecordingStatus;
    progress: number;
    failureReason: string | null;
    results: RecordingResults | null;
    attempts: number;
    startedAt: Date | null;
    analysedAt: Date | null;
    acceptedModeId: string | null;
    dialRpmApplied: boolean;
  }>,
  tx?: Tx,
): Promise<void> {
  await RecordingModel.update(changes, { where: { id }, transaction: tx ?? null });
}

/** Moves the progress forward only while the recording is still being analysed. */
export async function setProgress(id: string, progress: number): Promise<void> {
  await RecordingModel.update({ progress }, { where: { id, status: "analysing", progress: { [Op.lt]: progress } } });
}

/** How many recordings the shop holds (tests and diagnostics). */
export async function countRecordings(shopId: string): Promise<number> {
  return RecordingModel.count({ where: { shopId } });
}

