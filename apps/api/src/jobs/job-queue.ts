/**
 * The background-job queue: pg-boss on the application's own PostgreSQL (schema "pgboss", which
 * pg-boss creates and migrates itself). Jobs are rows, so they survive restarts, and any number of
 * worker processes can take them (each job goes to one worker: SKIP LOCKED).
 *
 * One queue per process: the API starts it to send jobs (and, unless RUN_WORKER=false, to work
 * them); `src/worker.ts` starts it to work them only.
 */
import PgBoss from "pg-boss";
import type pg from "pg";
import type { Tx } from "../db/sequelize.js";
import { AppError } from "../http/app-error.js";

/** Analysis of an uploaded recording: `{ recordingId }`. */
export const ANALYSIS_QUEUE = "recording-analysis";

export interface AnalysisJobData {
  recordingId: string;
}

/**
 * Retry policy of the analysis queue. A job that throws (an unexpected error, or a worker stopped
 * mid-job) is tried again after 10 s, at most twice more; a job still active after 15 minutes is
 * taken to be lost with its worker and handed out again.
 */
export const ANALYSIS_QUEUE_OPTIONS = { retryLimit: 2, retryDelay: 10, expireInSeconds: 15 * 60 } as const;

let boss: PgBoss | undefined;

/** Starts this process's queue client (idempotent per process) and makes sure the queues exist. */
export async function startJobQueue(databaseUrl: string, log: (line: string) => void = () => undefined): Promise<PgBoss> {
  if (boss) return boss;
  const created = new PgBoss({ connectionString: databaseUrl, schema: "pgboss", max: 4, application_name: "ringdown-jobs" });
  created.on("error", (error: Error) => log(`job queue error: ${error.message}`));
  await created.start();
  await created.createQueue(ANALYSIS_QUEUE, { name: ANALYSIS_QUEUE, ...ANALYSIS_QUEUE_OPTIONS });
  boss = created;
  return created;
}

/** The started queue; a request that needs it while it is down gets a clear 503. */
export function jobQueue(): PgBoss {
  if (!boss) throw new AppError("service_unavailable", "The analysis queue is not running. Try again in a moment.");
  return boss;
}

/** Stops the queue: with `graceful`, running jobs finish first (bounded by pg-boss's timeout). */
export async function stopJobQueue(options: { graceful?: boolean; timeoutMs?: number } = {}): Promise<void> {
  const current = boss;
  boss = undefined;
  if (!current) return;
  // wait (pg-boss's default): resolves once running jobs ended (or the timeout passed) and the pool closed.
  await current.stop({ graceful: options.graceful ?? true, timeout: options.timeoutMs ?? 30_000 });
}

/**
 * Sends an analysis job inside the caller's database transaction (pg-boss's `db` option on the
 * transaction's own connection): the recording row and its job are committed together or not at
 * all, so a recording is never left queued without a job, nor a job without its recording.
 */
export async function enqueueAnalysis(data: AnalysisJobData, tx: Tx): Promise<string> {
  const queue = jobQueue();
  const connection = (tx as unknown as { connection?: pg.ClientBase }).connection;
  if (!connection) throw new Error("enqueueAnalysis needs a started transaction");
  const id = await queue.send(ANALYSIS_QUEUE, data, { db: { executeSql: (text, values) => connection.query(text, values) } });
  if (!id) throw new Error(`pg-boss did not accept the ${ANALYSIS_QUEUE} job`);
  return id;
}
