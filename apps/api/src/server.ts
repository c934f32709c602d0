/**
 * Starts the API: reads the configuration, creates the database if missing, applies migrations,
 * seeds the demo scenario when SEED_DEMO=true, then listens. SIGINT/SIGTERM stop it gracefully.
 */
import type { Server } from "node:http";
import { createApp } from "./app.js";
import { ConfigError, readConfig, type AppConfig } from "./config/env.js";
import { ensureDatabase, redact } from "./db/database-admin.js";
import { migrate } from "./db/migrate.js";
import { closeDatabase, connectDatabase, getSequelize } from "./db/sequelize.js";
import { purgeExpiredRateLimits, settleRateLimitWrites } from "./http/rate-limit-store.js";
import { seedDemo } from "./seed/index.js";
import { settleBackgroundMail } from "./modules/mail/background.js";
import { startJobQueue, stopJobQueue } from "./jobs/job-queue.js";
import { startAnalysisWorker } from "./modules/analysis/analysis.worker.js";
import { LocalDirectoryStorage } from "./storage/local-directory-storage.js";

const log = (line: string) => console.log(`[ringdown-api] ${line}`);

function fail(message: string): never {
  console.error(`[ringdown-api] ${message}`);
  process.exit(1);
}

/** One clear line for the failures people actually meet at start-up. */
function describeStartupError(error: unknown, config: AppConfig): string {
  const code = (error as { code?: string; parent?: { code?: string } }).code ?? (error as { parent?: { code?: string } }).parent?.code;
  const where = redact(config.databaseUrl);
  if (code === "ECONNREFUSED" || code === "ENOTFOUND" || code === "ETIMEDOUT") {
    return `Cannot reach PostgreSQL at ${where} (${code}). Is it running? For the local cluster: bash docker-free-db/pg.sh start dev`;
  }
  if (code === "28P01" || code === "28000") return `PostgreSQL refused the credentials in DATABASE_URL (${where}).`;
  const message = error instanceof Error ? error.message : String(error);
  return `Start-up failed: ${message}`;
}

function listen(app: ReturnType<typeof createApp>, port: number): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = app.listen(port);
    server.once("listening", () => resolve(server));
    server.once("error", reject);
  });
}

async function main(): Promise<void> {
  let config: AppConfig;
  try {
    config = readConfig();
  } catch (error) {
    if (error instanceof ConfigError) fail(error.message);
    throw error;
  }

  try {
    if (await ensureDatabase(config.databaseUrl)) log(`created database ${redact(config.databaseUrl)}`);
    const sequelize = connectDatabase(config.databaseUrl);
    const applied = await migrate(sequelize, config.databaseUrl);
    log(applied.length > 0 ? `applied migrations: ${applied.join(", ")}` : "database schema up to date");
    if (config.seedDemo) await seedDemo(log);
    // The job queue: uploads send analysis jobs; unless RUN_WORKER=false this process works them too.
    const boss = await startJobQueue(config.databaseUrl, log);
    if (config.jobs.runWorker) {
      await startAnalysisWorker(boss, { storage: new LocalDirectoryStorage(config.storageDir), log }, config.jobs.analysisConcurrency);
      log(`analysis worker running (${config.jobs.analysisConcurrency} at a time)`);
    } else log("analysis worker off in this process (RUN_WORKER=false): run npm run worker -w @ringdown/api");
  } catch (error) {
    await stopJobQueue({ graceful: false }).catch(() => undefined);
    await closeDatabase().catch(() => undefined);
    fail(describeStartupError(error, config));
  }

  let server: Server;
  try {
    server = await listen(createApp(config), config.port);
  } catch (error) {
    await closeDatabase().catch(() => undefined);
    if ((error as { code?: string }).code === "EADDRINUSE") {
      fail(`Port ${config.port} is already in use. Stop the program using it, or set PORT to a free port.`);
    }
    if ((error as { code?: string }).code === "EACCES") fail(`Not allowed to listen on port ${config.port}; set PORT to a port above 1023.`);
    throw error;
  }
  log(`listening on http://localhost:${config.port} (API at /api, web app from ${config.webDist})`);

  const purge = setInterval(() => {
    purgeExpiredRateLimits(getSequelize()).catch((error: unknown) => console.error("[ringdown-api] rate-limit purge failed:", error));
  }, 60 * 60_000);
  purge.unref();

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) {
      log(`${signal} again: exiting now`);
      process.exit(1);
    }
    stopping = true;
    log(`${signal} received: finishing open requests, then stopping`);
    clearInterval(purge);
    const force = setTimeout(() => {
      log("requests still open after 10 s: exiting anyway");
      process.exit(1);
    }, 10_000);
    force.unref();
    server.close(() => {
      // Password-reset e-mails are sent after their response: let them go out before stopping.
      Promise.all([settleRateLimitWrites(), settleBackgroundMail()])
        // A running analysis may finish for up to 8 s; an unfinished one is handed out again later.
        .then(() => stopJobQueue({ graceful: true, timeoutMs: 8_000 }))
        .then(closeDatabase)
        .catch((error: unknown) => console.error("[ringdown-api] closing the database failed:", error))
        .finally(() => {
          log("stopped");
          process.exit(0);
        });
    });
    server.closeIdleConnections();
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

main().catch((error: unknown) => {
  console.error("[ringdown-api] unexpected start-up failure:", error);
  process.exit(1);
});
