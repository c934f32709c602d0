import type { Health } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { apiVersion } from "../../version.js";

const DB_TIMEOUT_MS = 2_000;

/** Whether PostgreSQL answers a trivial query within two seconds. */
export async function checkHealth(): Promise<Health> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error("database health check timed out")), DB_TIMEOUT_MS);
  });
  try {
    await Promise.race([getSequelize().query("SELECT 1"), timeout]);
    return { status: "ok", database: "up", version: apiVersion };
  } catch {
    return { status: "degraded", database: "down", version: apiVersion };
  } finally {
    clearTimeout(timer);
  }
}
