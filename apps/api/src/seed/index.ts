import { getSequelize } from "../db/sequelize.js";
import { seedLibrary } from "./library.js";
import { seedPeopleAndShops } from "./people-and-shops.js";
import { seedRecipes } from "./recipes.js";
import { seedTeamPlans } from "./team-plans.js";
import { seedVibration } from "./vibration.js";

/** Seed modules, one per area, run in order. Later areas append theirs here. */
const steps: Array<{ area: string; run: () => Promise<number> }> = [
  { area: "people and shops", run: seedPeopleAndShops },
  { area: "team plans", run: () => seedTeamPlans() },
  { area: "library (machines, cutters, assemblies)", run: seedLibrary },
  // Before the recipes: recipes take the stiffness map at their work position.
  { area: "vibration profiles (stiffness and backlash readings, analysed recordings)", run: () => seedVibration() },
  { area: "recipes (revisions, status history, cut logs)", run: () => seedRecipes() },
];

// Any constant shared by every process; serialises concurrent seeding of one database.
const SEED_LOCK_KEY = 72_104_002;

/**
 * Loads the invented demo scenario; safe to run on every start. Several processes (API instances,
 * test files running side by side) may seed one database at once: a PostgreSQL advisory lock held
 * on one pooled connection lets one seed while the others wait and then find everything present.
 */
export async function seedDemo(log: (line: string) => void = () => undefined): Promise<void> {
  const manager = getSequelize().connectionManager as unknown as {
    getConnection(): Promise<{ query(sql: string, values?: unknown[]): Promise<unknown> }>;
    releaseConnection(connection: unknown): Promise<void>;
  };
  const connection = await manager.getConnection();
  try {
    await connection.query("SELECT pg_advisory_lock($1)", [SEED_LOCK_KEY]);
    for (const step of steps) {
      const created = await step.run();
      log(created > 0 ? `demo seed: ${step.area} — ${created} records created` : `demo seed: ${step.area} — already present`);
    }
  } finally {
    await connection.query("SELECT pg_advisory_unlock($1)", [SEED_LOCK_KEY]).catch(() => undefined);
    await manager.releaseConnection(connection);
  }
}
