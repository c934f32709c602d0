import pg from "pg";
import type { Sequelize } from "sequelize";
import { SequelizeStorage, Umzug, type MigrationFn } from "umzug";
import * as m0001 from "./migrations/0001-users-shops-memberships.js";
import * as m0002 from "./migrations/0002-sessions-and-rate-limits.js";
import * as m0003 from "./migrations/0003-library-and-recipes.js";
import * as m0010 from "./migrations/0010-recipe-ladders-and-list-indexes.js";
import * as m0011 from "./migrations/0011-recipe-operation-index.js";
import * as m0020 from "./migrations/0020-team-and-billing.js";
import * as m0030 from "./migrations/0030-vibration-profiles.js";
import * as m0040 from "./migrations/0040-audit-log.js";
import * as m0041 from "./migrations/0041-recipe-filter-newest-first-indexes.js";
import * as m0042 from "./migrations/0042-recipe-search-per-shop.js";
import { syncGlobalMaterials } from "../modules/materials/global-materials.sync.js";

type Migration = { up: MigrationFn<Sequelize>; down: MigrationFn<Sequelize> };

// Explicit list (no file globbing): new migrations are appended here, in order, never renamed.
const migrations: Array<{ name: string } & Migration> = [
  { name: "0001-users-shops-memberships", ...m0001 },
  { name: "0002-sessions-and-rate-limits", ...m0002 },
  { name: "0003-library-and-recipes", ...m0003 },
  { name: "0010-recipe-ladders-and-list-indexes", ...m0010 },
  { name: "0011-recipe-operation-index", ...m0011 },
  { name: "0020-team-and-billing", ...m0020 },
  { name: "0030-vibration-profiles", ...m0030 },
  { name: "0040-audit-log", ...m0040 },
  { name: "0041-recipe-filter-newest-first-indexes", ...m0041 },
  { name: "0042-recipe-search-per-shop", ...m0042 },
];

// Any constant shared by every API instance; serialises concurrent start-ups on one database.
const MIGRATION_LOCK_KEY = 72_104_001;

function umzugFor(sequelize: Sequelize) {
  return new Umzug<Sequelize>({
    migrations,
    context: sequelize,
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migrations" }),
    logger: undefined,
  });
}

/**
 * Applies pending migrations, then brings the reference data every database needs (the global
 * material library) up to date. Several API instances may start at once, so the run holds a
 * PostgreSQL advisory lock on a separate connection; the others wait and then find nothing to do.
 * Returns the names of the migrations applied.
 */
export async function migrate(sequelize: Sequelize, databaseUrl: string): Promise<string[]> {
  const lock = new pg.Client({ connectionString: databaseUrl, connectionTimeoutMillis: 5_000 });
  await lock.connect();
  try {
    await lock.query("SELECT pg_advisory_lock($1)", [MIGRATION_LOCK_KEY]);
    const applied = await umzugFor(sequelize).up();
    await syncGlobalMaterials(sequelize);
    return applied.map((m) => m.name);
  } finally {
    await lock.query("SELECT pg_advisory_unlock($1)", [MIGRATION_LOCK_KEY]).catch(() => undefined);
    await lock.end();
  }
}

/** Names of migrations not applied yet (for tests and diagnostics). */
export async function pendingMigrations(sequelize: Sequelize): Promise<string[]> {
  return (await umzugFor(sequelize).pending()).map((m) => m.name);
}
