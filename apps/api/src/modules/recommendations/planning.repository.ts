/**
 * Reads the library rows a recipe is computed from (machine with its modes, cutter assembly,
 * cutter, material) straight from their tables, always filtered by the shop, and returns them in
 * their contract shapes. Deleted rows are never returned. Materials include the global library.
 */
import { QueryTypes } from "sequelize";
import {
  assemblySchema,
  cutterSchema,
  machineSchema,
  materialSchema,
  type Assembly,
  type Cutter,
  type Machine,
  type Material,
} from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";

type Row = Record<string, unknown>;

/** Timestamps arrive as Date (plain columns) or text (inside to_jsonb); both leave as ISO 8601. */
const iso = (v: unknown): string => (v instanceof Date ? v : new Date(String(v))).toISOString();
const isoOrNull = (v: unknown): string | null => (v === null || v === undefined ? null : iso(v));

async function select(sql: string, replacements: Record<string, unknown>, tx?: Tx): Promise<Row[]> {
  return getSequelize().query<Row>(sql, { replacements, type: QueryTypes.SELECT, transaction: tx ?? null });
}

export function toMaterial(r: Row): Material {
  return materialSchema.parse({
    id: r.id,
    shopId: r.shop_id,
    readOnly: r.shop_id === null,
    copiedFromId: r.copied_from_id,
    name: r.name,
    group: r.material_group,
    hardness: r.hardness,
    cuttingSpeed: r.cutting_speed,
    chipLoad: r.chip_load,
    kc11NPerMm2: r.kc11_n_per_mm2,
    mc: r.mc,
    unitPowerJPerMm3: r.unit_power_j_per_mm3,
    minChipThicknessMm: r.min_chip_thickness_mm,
    sourceNote: r.source_note,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    deletedAt: isoOrNull(r.deleted_at),
  });
}

export function toCutter(r: Row): Cutter {
  return cutterSchema.parse({
    id: r.id,
    shopId: r.shop_id,
    name: r.name,
    shape: r.shape,
    diameterMm: r.diameter_mm,
    flutes: r.flutes,
    fluteLengthMm: r.flute_length_mm,
    overallLengthMm: r.overall_length_mm,
    shankDiameterMm: r.shank_diameter_mm,
    helixDeg: r.helix_deg,
    cornerRadiusMm: r.corner_radius_mm,
    tipAngleDeg: r.tip_angle_deg,
    toolMaterial: r.tool_material,
    coating: r.coating,
    maker: r.maker,
    partNumber: r.part_number,
    maxRpm: r.max_rpm,
    notes: r.notes,
    status: r.status,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    deletedAt: isoOrNull(r.deleted_at),
  });
}

export function toAssembly(r: Row): Assembly {
  return assemblySchema.parse({
    id: r.id,
    shopId: r.shop_id,
    machineId: r.machine_id,
    cutterId: r.cutter_id,
    holder: r.holder,
    stickoutMm: r.stickout_mm,
    runoutMm: r.runout_mm,
    notes: r.notes,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    deletedAt: isoOrNull(r.deleted_at),
  });
}

export function toMachine(r: Row, modes: Row[], stiffnessReadings?: Row[]): Machine {
  return machineSchema.parse({
    id: r.id,
    shopId: r.shop_id,
    name: r.name,
    kind: r.kind,
    spindle: r.spindle,
    axes: r.axes,
    modes: modes.map((m) => ({
      direction: m.direction,
      frequencyHz: m.frequency_hz,
      dampingRatio: m.damping_ratio,
      stiffnessNPerMm: m.stiffness_n_per_mm,
      source: m.source,
      note: m.note,
    })),
    ...(stiffnessReadings
      ? {
          stiffnessPoints: stiffnessReadings.map((p) => ({
            xMm: p.x_mm,
            yMm: p.y_mm,
            direction: p.direction,
            stiffnessNPerMm: p.stiffness_n_per_mm,
          })),
        }
      : {}),
    deflectionCeilingMm: r.deflection_ceiling_mm,
    avoidBands: r.avoid_bands,
    modeMarginPct: r.mode_margin_pct,
    estimatedFields: r.estimated_fields,
    notes: r.notes,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    deletedAt: isoOrNull(r.deleted_at),
  });
}

/** Everything needed to compute a recipe on one assembly. */
export interface PlanningRecords {
  machine: Machine;
  assembly: Assembly;
  cutter: Cutter;
}

/** The assembly with its machine and cutter, or null when any of them is missing, deleted or another shop's. */
export async function findAssemblyRecords(shopId: string, assemblyId: string, tx?: Tx): Promise<PlanningRecords | null> {
  const rows = await select(
    `SELECT to_jsonb(a.*) AS a, to_jsonb(m.*) AS m, to_jsonb(c.*) AS c
       FROM assemblies a
       JOIN machines m ON m.id = a.machine_id AND m.shop_id = a.shop_id AND m.deleted_at IS NULL
       JOIN cutters c ON c.id = a.cutter_id AND c.shop_id = a.shop_id AND c.deleted_at IS NULL
      WHERE a.shop_id = :shopId AND a.id = :assemblyId AND a.deleted_at IS NULL`,
    { shopId, assemblyId },
    tx,
  );
  const row = rows[0];
  if (!row) return null;
  const m = row.m as Row;
  const modes = await select(
    `SELECT * FROM machine_modes WHERE shop_id = :shopId AND machine_id = :machineId ORDER BY direction, frequency_hz`,
    { shopId, machineId: m.id },
    tx,
  );
  // The measured stiffness map: the engine takes it at the work position (or over the work region).
  const readings = await select(
    `SELECT x_mm, y_mm, direction, stiffness_n_per_mm FROM stiffness_readings
      WHERE shop_id = :shopId AND machine_id = :machineId ORDER BY measured_at, created_at, id`,
    { shopId, machineId: m.id },
    tx,
  );
  return { machine: toMachine(m, modes, readings), assembly: toAssembly(row.a as Row), cutter: toCutter(row.c as Row) };
}

/** A material this shop may use: its own (not deleted) or a global one. */
export async function findUsableMaterial(shopId: string, materialId: string, tx?: Tx): Promise<Material | null> {
  const rows = await select(
    `SELECT * FROM materials WHERE id = :materialId AND (shop_id = :shopId OR shop_id IS NULL) AND deleted_at IS NULL`,
    { shopId, materialId },
    tx,
  );
  return rows[0] ? toMaterial(rows[0]) : null;
}

// ---------------------------------------------------------------- whole-shop reads (export)

export async function listShopMaterials(shopId: string): Promise<Material[]> {
  return (await select(`SELECT * FROM materials WHERE shop_id = :shopId ORDER BY name, id`, { shopId })).map(toMaterial);
}

/** Global materials the shop's recipes use (so an export names every material it refers to). */
export async function listGlobalMaterialsUsedBy(shopId: string): Promise<Material[]> {
  const rows = await select(
    `SELECT * FROM materials m
      WHERE m.shop_id IS NULL AND EXISTS (SELECT 1 FROM recipes r WHERE r.shop_id = :shopId AND r.material_id = m.id)
      ORDER BY m.name, m.id`,
    { shopId },
  );
  return rows.map(toMaterial);
}

export async function listShopCutters(shopId: string): Promise<Cutter[]> {
  return (await select(`SELECT * FROM cutters WHERE shop_id = :shopId ORDER BY name, id`, { shopId })).map(toCutter);
}

export async function listShopAssemblies(shopId: string): Promise<Array<Assembly & { machineName: string; cutterName: string }>> {
  const rows = await select(
    `SELECT a.*, m.name AS machine_name, c.name AS cutter_name
       FROM assemblies a JOIN machines m ON m.id = a.machine_id JOIN cutters c ON c.id = a.cutter_id
      WHERE a.shop_id = :shopId ORDER BY m.name, c.name, a.id`,
    { shopId },
  );
  return rows.map((r) => ({ ...toAssembly(r), machineName: String(r.machine_name), cutterName: String(r.cutter_name) }));
}

export async function listShopMachines(shopId: string): Promise<Machine[]> {
  const machines = await select(`SELECT * FROM machines WHERE shop_id = :shopId ORDER BY name, id`, { shopId });
  const modes = await select(`SELECT * FROM machine_modes WHERE shop_id = :shopId ORDER BY direction, frequency_hz`, { shopId });
  return machines.map((m) => toMachine(m, modes.filter((mode) => mode.machine_id === m.id)));
}
