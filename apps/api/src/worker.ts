/**
 * A separate analysis worker: takes recording-analysis jobs from the PostgreSQL queue (pg-boss)
 * and writes their results, like the worker inside the API process. Run as many as needed, on
 * this or other machines sharing the database and the storage directory:
 *   npm run worker -w @ringdown/api          (development, TypeScript source)
 *   node apps/api/dist/worker.js              (after npm run build)
 * SIGINT/SIGTERM: finish the running analysis (up to 25 s), then stop.
 */
import { ConfigError, readConfig } from "./config/env.js";
import { migrate } from "./db/migrate.js";
import { closeDatabase, connectDatabase } from "./db/sequelize.js";
import { startJobQueue, stopJobQueue } from "./jobs/job-queue.js";
import { startAnalysisWorker } from "./modules/analysis/analysis.worker.js";
import { LocalDirectoryStorage } from "./storage/local-directory-storage.js";

const log = (line: string) => console.log(`[ringdown-worker] ${line}`);

async function main(): Promise<void> {
  let config;
  try {
    config = readConfig();
  } catch (error) {
    if (error instanceof ConfigError) {
      console.error(`[ringdown-worker] ${error.message}`);
      process.exit(1);
    }
    throw error;
  }
  const sequelize = connectDatabase(config.databaseUrl);
  // The schema must be current before jobs are read (an API start does the same under the same lock).
  const applied = await migrate(sequelize, config.databaseUrl);
  log(applied.length > 0 ? `applied migrations: ${applied.join(", ")}` : "database schema up to date");
  const boss = await startJobQueue(config.databaseUrl, log);
  await startAnalysisWorker(boss, { storage: new LocalDirectoryStorage(config.storageDir), log }, config.jobs.analysisConcurrency);
  log(`working recording analyses (${config.jobs.analysisConcurrency} at a time)`);

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) process.exit(1);
    stopping = true;
    log(`${signal} received: finishing the running analysis, then stopping`);
    stopJobQueue({ graceful: true, timeoutMs: 25_000 })
      .then(closeDatabase)
      .catch((error: unknown) => console.error("[ringdown-worker] stopping failed:", error))
      .finally(() => {
        log("stopped");
        process.exit(0);
      });
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

main().catch((error: unknown) => {
  console.error("[ringdown-worker] start-up failed:", error);
  process.exit(1);
});
