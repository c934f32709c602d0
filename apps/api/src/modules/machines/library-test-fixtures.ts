/**
 * Shared set-up for the library route tests: a shop with one person per role, valid request
 * bodies, and a recipe row written straight into the table (the recipes module has its own
 * routes and tests; here a recipe only needs to exist to prove that deletes are refused).
 * All values are ILLUSTRATIVE: invented machines, cutters and materials.
 */
import type { Express } from "express";
import type { Role } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { createPerson, joinShop, type SignedUp } from "../../test/harness.js";
import { saveSubscription } from "../billing/billing.repository.js";

export type Team = Record<Role, SignedUp> & { shopId: string };

/** An owner's new shop with a tooling manager, a programmer and an operator in it. */
export async function teamShop(app: Express, label: string): Promise<Team> {
  const owner = await createPerson(app, `${label}-owner`, `Library shop ${label}`);
  const team = { owner, shopId: owner.shopId } as Team;
  for (const role of ["tooling_manager", "programmer", "operator"] as const) {
    team[role] = await createPerson(app, `${label}-${role}`);
    await joinShop(team[role].userId, owner.shopId, role);
  }
  // On the team plan, so the free plan's one-machine limit does not get in the way of the tests.
  await saveSubscription(owner.shopId, { status: "active", seats: 10 });
  return team;
}

export const cutterBody = (overrides: Record<string, unknown> = {}) => ({
  name: "Test 6 mm flat",
  shape: "flat",
  diameterMm: 6,
  flutes: 2,
  fluteLengthMm: 20,
  overallLengthMm: 60,
  shankDiameterMm: 6,
  helixDeg: 30,
  cornerRadiusMm: 0,
  toolMaterial: "carbide",
  maxRpm: 24000,
  ...overrides,
});

const axis = (drive: string, stiffnessNPerMm: number) => ({
  drive,
  travelMm: 600,
  maxFeedMmPerMin: 5000,
  accelerationMmPerS2: 500,
  backlashMm: 0.02,
  movingMassKg: 10,
  stiffnessNPerMm,
});

export const machineBody = (overrides: Record<string, unknown> = {}) => ({
  name: "Test router",
  kind: "gantry_router",
  spindle: { minRpm: 8000, maxRpm: 24000, powerW: 1500 },
  axes: { x: axis("belt", 400), y: axis("belt", 300), z: axis("lead_screw", 800) },
  modes: [{ direction: "y", frequencyHz: 25, dampingRatio: 0.03, stiffnessNPerMm: 250 }],
  ...overrides,
});

export const materialBody = (overrides: Record<string, unknown> = {}) => ({
  name: "Test walnut",
  group: "hardwood",
  cuttingSpeed: { carbide: { minMPerMin: 150, maxMPerMin: 900 }, hss: { minMPerMin: 80, maxMPerMin: 400 } },
  chipLoad: [
    { diameterMm: 3.175, minMm: 0.06, maxMm: 0.1 },
    { diameterMm: 6.35, minMm: 0.15, maxMm: 0.23 },
  ],
  kc11NPerMm2: null,
  mc: null,
  unitPowerJPerMm3: 0.08,
  minChipThicknessMm: 0.05,
  sourceNote: "ILLUSTRATIVE test row",
  ...overrides,
});

/** A recipe row using the given library rows (values are placeholders, not engine output). */
export async function insertRecipeRow(input: {
  shopId: string;
  assemblyId: string;
  machineId: string;
  cutterId: string;
  materialId: string;
  authorId: string;
}): Promise<string> {
  const [rows] = await getSequelize().query(
    `INSERT INTO recipes (shop_id, name, assembly_id, machine_id, cutter_id, material_id, operation, params, result,
                          rpm, feed_mm_per_min, author_id)
     VALUES ($1, 'Referencing recipe', $2, $3, $4, $5, 'slot', '{}'::jsonb, '{}'::jsonb, 18000, 1800, $6)
     RETURNING id`,
    { bind: [input.shopId, input.assemblyId, input.machineId, input.cutterId, input.materialId, input.authorId] },
  );
  return (rows[0] as { id: string }).id;
}

export async function needsRecheck(recipeId: string): Promise<boolean> {
  const [rows] = await getSequelize().query("SELECT needs_recheck FROM recipes WHERE id = $1", { bind: [recipeId] });
  return (rows[0] as { needs_recheck: boolean }).needs_recheck;
}

/** Id of a global material by its key. */
export async function globalMaterialId(key: string): Promise<string> {
  const [rows] = await getSequelize().query("SELECT id FROM materials WHERE global_key = $1", { bind: [key] });
  const row = rows[0] as { id: string } | undefined;
  if (!row) throw new Error(`no global material ${key}`);
  return row.id;
}
