import { recreateDatabase, redact } from "../db/database-admin.js";
import { migrate } from "../db/migrate.js";
import { closeDatabase, connectDatabase } from "../db/sequelize.js";
import { testDatabaseUrl } from "./database-url.js";

/** Recreates the test database once per run and migrates it; test files then share it. */
export default async function setup(): Promise<void> {
  const url = testDatabaseUrl();
  try {
    await recreateDatabase(url);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new Error(
      `Cannot prepare the test database ${redact(url)}: ${reason}\n` +
        `Start the test cluster with: bash docker-free-db/pg.sh start test`,
    );
  }
  const sequelize = connectDatabase(url);
  try {
    await migrate(sequelize, url);
  } finally {
    await closeDatabase();
  }
}
