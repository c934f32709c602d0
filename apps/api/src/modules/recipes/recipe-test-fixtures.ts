/**
 * Library rows for recipe tests, written straight into the tables (the library routes have their
 * own tests). All values are ILLUSTRATIVE: an invented light router and bench mill, a 6 mm
 * two-flute carbide end mill and two shop materials shaped like the global library's rows.
 */
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import type { CutterStatus, MachineBody, MaterialBody } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";

async function run(sql: string, replacements: Record<string, unknown>): Promise<void> {
  await getSequelize().query(sql, { replacements, type: QueryTypes.INSERT });
}

const axis = (maxFeed: number, stiffness: number, backlash = 0) => ({
  drive: "ball_screw" as const,
  travelMm: 600,
  maxFeedMmPerMin: maxFeed,
  accelerationMmPerS2: null,
  backlashMm: backlash,
  movingMassKg: null,
  stiffnessNPerMm: stiffness,
});

export const routerMachine: Omit<MachineBody, "modes"> & { modes: MachineBody["modes"] } = {
  name: "Test gantry router",
  kind: "gantry_router",
  spindle: { minRpm: 8000, maxRpm: 24000, powerW: 1500, powerCurve: [], dialSettings: [] },
  axes: { x: axis(10000, 1500), y: axis(10000, 1200), z: axis(3000, 3000) },
  modes: [
    { direction: "x", frequencyHz: 780, dampingRatio: 0.03, stiffnessNPerMm: 4000, source: "measured", note: "spindle mount" },
    { direction: "y", frequencyHz: 820, dampingRatio: 0.035, stiffnessNPerMm: 3500, source: "measured", note: "spindle mount" },
  ],
  deflectionCeilingMm: 0.025,
  avoidBands: [],
  modeMarginPct: 10,
  estimatedFields: [],
  notes: "",
};

export const millMachine: typeof routerMachine = {
  ...routerMachine,
  name: "Test bench mill",
  kind: "bench_mill",
  spindle: { minRpm: 500, maxRpm: 6000, powerW: 1100, powerCurve: [], dialSettings: [] },
  axes: { x: axis(2000, 8000), y: axis(2000, 7000), z: axis(1000, 9000) },
  modes: [{ direction: "x", frequencyHz: 310, dampingRatio: 0.04, stiffnessNPerMm: 15000, source: "estimated", note: "column" }],
};

export const aluminium: MaterialBody = {
  name: "Test aluminium 6061",
  group: "aluminium",
  hardness: "",
  cuttingSpeed: { carbide: { minMPerMin: 250, maxMPerMin: 600 }, hss: { minMPerMin: 60, maxMPerMin: 120 } },
  chipLoad: [
    { diameterMm: 3, minMm: 0.015, maxMm: 0.025 },
    { diameterMm: 6, minMm: 0.03, maxMm: 0.05 },
    { diameterMm: 12, minMm: 0.06, maxMm: 0.1 },
  ],
  kc11NPerMm2: 800,
  mc: 0.25,
  unitPowerJPerMm3: null,
  minChipThicknessMm: 0.005,
  sourceNote: "ILLUSTRATIVE test row",
};

export const mdf: MaterialBody = {
  name: "Test MDF",
  group: "wood_panel",
  hardness: "",
  cuttingSpeed: { carbide: { minMPerMin: 200, maxMPerMin: 900 }, hss: { minMPerMin: 100, maxMPerMin: 400 } },
  chipLoad: [
    { diameterMm: 3.175, minMm: 0.08, maxMm: 0.13 },
    { diameterMm: 6.35, minMm: 0.15, maxMm: 0.25 },
  ],
  kc11NPerMm2: null,
  mc: null,
  unitPowerJPerMm3: 0.06,
  minChipThicknessMm: 0.05,
  sourceNote: "ILLUSTRATIVE test row",
};

export async function insertMachine(shopId: string, machine: typeof routerMachine = routerMachine): Promise<string> {
  const id = randomUUID();
  await run(
    `INSERT INTO machines (id, shop_id, name, kind, spindle, axes, deflection_ceiling_mm, avoid_bands, mode_margin_pct, estimated_fields, notes)
     VALUES (:id, :shopId, :name, :kind, :spindle, :axes, :ceiling, :bands, :margin, :estimated, :notes)`,
    {
      id,
      shopId,
      name: machine.name,
      kind: machine.kind,
      spindle: JSON.stringify(machine.spindle),
      axes: JSON.stringify(machine.axes),
      ceiling: machine.deflectionCeilingMm,
      bands: JSON.stringify(machine.avoidBands),
      margin: machine.modeMarginPct,
      estimated: JSON.stringify(machine.estimatedFields),
      notes: machine.notes,
    },
  );
  for (const mode of machine.modes) {
    await run(
      `INSERT INTO machine_modes (shop_id, machine_id, direction, frequency_hz, damping_ratio, stiffness_n_per_mm, source, note)
       VALUES (:shopId, :id, :direction, :f, :zeta, :k, :source, :note)`,
      { shopId, id, direction: mode.direction, f: mode.frequencyHz, zeta: mode.dampingRatio, k: mode.stiffnessNPerMm, source: mode.source, note: mode.note },
    );
  }
  return id;
}

export async function insertCutter(
  shopId: string,
  overrides: Partial<{ name: string; shape: string; diameterMm: number; flutes: number; fluteLengthMm: number; status: CutterStatus; maxRpm: number | null }> = {},
): Promise<string> {
  const id = randomUUID();
  const c = { name: "Test 6 mm 2F flat", shape: "flat", diameterMm: 6, flutes: 2, fluteLengthMm: 18, status: "approved" as CutterStatus, maxRpm: 30000, ...overrides };
  await run(
    `INSERT INTO cutters (id, shop_id, name, shape, diameter_mm, flutes, flute_length_mm, overall_length_mm, shank_diameter_mm, helix_deg, tool_material, max_rpm, status)
     VALUES (:id, :shopId, :name, :shape, :d, :z, :lf, 60, :d, 30, 'carbide', :maxRpm, :status)`,
    { id, shopId, name: c.name, shape: c.shape, d: c.diameterMm, z: c.flutes, lf: c.fluteLengthMm, maxRpm: c.maxRpm, status: c.status },
  );
  return id;
}

export async function insertAssembly(shopId: string, machineId: string, cutterId: string, stickoutMm = 24, runoutMm = 0.005): Promise<string> {
  const id = randomUUID();
  await run(
    `INSERT INTO assemblies (id, shop_id, machine_id, cutter_id, holder, stickout_mm, runout_mm) VALUES (:id, :shopId, :machineId, :cutterId, 'ER20 collet', :s, :r)`,
    { id, shopId, machineId, cutterId, s: stickoutMm, r: runoutMm },
  );
  return id;
}

export async function insertMaterial(shopId: string, material: MaterialBody = aluminium): Promise<string> {
  const id = randomUUID();
  await run(
    `INSERT INTO materials (id, shop_id, name, material_group, hardness, cutting_speed, chip_load, kc11_n_per_mm2, mc, unit_power_j_per_mm3, min_chip_thickness_mm, source_note)
     VALUES (:id, :shopId, :name, :group, :hardness, :speed, :chip, :kc, :mc, :u, :hmin, :source)`,
    {
      id,
      shopId,
      name: material.name,
      group: material.group,
      hardness: material.hardness,
      speed: JSON.stringify(material.cuttingSpeed),
      chip: JSON.stringify(material.chipLoad),
      kc: material.kc11NPerMm2,
      mc: material.mc,
      u: material.unitPowerJPerMm3,
      hmin: material.minChipThicknessMm,
      source: material.sourceNote,
    },
  );
  return id;
}

/** A shop's small library: a router and a mill, the same approved cutter on each, aluminium and MDF. */
export async function libraryFor(shopId: string) {
  const routerId = await insertMachine(shopId, routerMachine);
  const millId = await insertMachine(shopId, millMachine);
  const cutterId = await insertCutter(shopId);
  const routerAssemblyId = await insertAssembly(shopId, routerId, cutterId);
  const millAssemblyId = await insertAssembly(shopId, millId, cutterId, 20, 0.003);
  const aluminiumId = await insertMaterial(shopId, aluminium);
  const mdfId = await insertMaterial(shopId, mdf);
  return { routerId, millId, cutterId, routerAssemblyId, millAssemblyId, aluminiumId, mdfId };
}
