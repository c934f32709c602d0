import type PgBoss from "pg-boss";
import { recordingResultsSchema } from "@ringdown/contracts";
import { ANALYSIS_QUEUE, ANALYSIS_QUEUE_OPTIONS, type AnalysisJobData } from "../../jobs/job-queue.js";
import type { Storage } from "../../storage/storage.js";
import { findMachine } from "../machines/machines.repository.js";
import { decodeRecording, RecordingFileError } from "../recordings/recording-decoder.js";
import { findRecordingForJob, setProgress, updateRecording } from "../recordings/recordings.repository.js";
import { listStiffnessReadings } from "../stiffness/stiffness.repository.js";
import { worstCaseStiffness } from "../stiffness/stiffness.service.js";
import { AnalysisFailure, analyseRecording } from "./analyse-recording.js";

export interface AnalysisWorkerDeps {
  storage: Storage;
  log?: (line: string) => void;
}

async function readAll(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks);
}

/**
 * Analyses one recording: queued → analysing (progress 0 … 1) → done with results, or failed with
 * a reason. A reason about the file or the signal ends the job (trying again would fail the same
 * way). Anything else (database gone, a bug) is thrown so pg-boss tries again; the recording goes
 * back to queued until the last attempt, which marks it failed.
 */
export async function runAnalysisJob(
  recordingId: string,
  deps: AnalysisWorkerDeps,
  attempt: { retryCount: number; retryLimit: number } = { retryCount: 0, retryLimit: ANALYSIS_QUEUE_OPTIONS.retryLimit },
): Promise<void> {
  const recording = await findRecordingForJob(recordingId);
  // Deleted meanwhile, or already finished by another worker: nothing to do.
  if (!recording || recording.status === "done" || recording.status === "failed") return;
  await updateRecording(recording.id, { status: "analysing", progress: 0.05, attempts: recording.attempts + 1, startedAt: new Date(), failureReason: null });
  try {
    const stored = await deps.storage.get(recording.storageKey);
    if (!stored) throw new AnalysisFailure("The uploaded file is no longer in storage; upload it again.");
    const bytes = await readAll(stored.stream);
    await setProgress(recording.id, 0.2);
    const decoded = decodeRecording(bytes);
    await setProgress(recording.id, 0.4);
    const machine = await findMachine(recording.shopId, recording.machineId);
    if (!machine) throw new AnalysisFailure("The machine of this recording no longer exists.");
    let measuredStiffnessNPerMm: number | null = null;
    if (recording.kind === "tap" && recording.direction) {
      const readings = await listStiffnessReadings(recording.shopId, recording.machineId, recording.direction);
      measuredStiffnessNPerMm = worstCaseStiffness(readings, recording.direction, machine);
    }
    const results = await analyseRecording(decoded, {
      kind: recording.kind,
      rpm: recording.rpm,
      flutes: recording.flutes,
      direction: recording.direction,
      dialSetting: recording.dialSetting,
      machine,
      measuredStiffnessNPerMm,
      progress: (fraction) => setProgress(recording.id, fraction),
    });
    // Stored results always match the contract the pages read.
    const checked = recordingResultsSchema.parse(results);
    await updateRecording(recording.id, { status: "done", progress: 1, results: checked, analysedAt: new Date(), failureReason: null });
  } catch (error) {
    const known = error instanceof AnalysisFailure || error instanceof RecordingFileError;
    if (known) {
      await updateRecording(recording.id, { status: "failed", failureReason: error.message, analysedAt: new Date() });
      return;
    }
    const message = error instanceof Error ? error.message : String(error);
    deps.log?.(`analysis of recording ${recording.id} failed (attempt ${attempt.retryCount + 1}): ${error instanceof Error ? (error.stack ?? message) : message}`);
    if (attempt.retryCount >= attempt.retryLimit) {
      await updateRecording(recording.id, {
        status: "failed",
        failureReason: `The analysis stopped on an unexpected error after ${attempt.retryCount + 1} attempts (${message}).`,
        analysedAt: new Date(),
      }).catch(() => undefined);
      return;
    }
    await updateRecording(recording.id, { status: "queued", progress: 0 }).catch(() => undefined);
    throw error;
  }
}

/**
 * Takes analysis jobs from the queue: `concurrency` handlers, each one job at a time, polling
 * every 0.5 s. Returns the worker ids (for `offWork`).
 */
export async function startAnalysisWorker(boss: PgBoss, deps: AnalysisWorkerDeps, concurrency = 1): Promise<string[]> {
  const ids: string[] = [];
  for (let i = 0; i < concurrency; i++) {
    ids.push(
      await boss.work<AnalysisJobData>(ANALYSIS_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1, includeMetadata: true }, async ([job]) => {
        if (!job) return;
        await runAnalysisJob(job.data.recordingId, deps, { retryCount: job.retryCount, retryLimit: job.retryLimit });
      }),
    );
  }
  return ids;
}
