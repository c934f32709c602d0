import { Op, QueryTypes, type WhereOptions } from "sequelize";
import type { Axis, Machine, MachineBody, MachineListQuery, MachineMode, MachineStiffnessPoint } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { likePattern } from "../materials/materials.repository.js";
import { MachineModeModel } from "./machine-mode.model.js";
import { MachineModel } from "./machine.model.js";

const toMode = (m: MachineModeModel): MachineMode => ({
  direction: m.direction,
  frequencyHz: m.frequencyHz,
  dampingRatio: m.dampingRatio,
  stiffnessNPerMm: m.stiffnessNPerMm,
  source: m.source,
  note: m.note,
});

function toMachine(row: MachineModel, modes: MachineModeModel[], stiffnessPoints: MachineStiffnessPoint[]): Machine {
  return {
    id: row.id,
    shopId: row.shopId,
    name: row.name,
    kind: row.kind,
    spindle: row.spindle,
    axes: row.axes,
    modes: modes.map(toMode),
    stiffnessPoints,
    deflectionCeilingMm: row.deflectionCeilingMm,
    avoidBands: row.avoidBands,
    modeMarginPct: row.modeMarginPct,
    estimatedFields: row.estimatedFields,
    notes: row.notes,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    deletedAt: row.deletedAt ? row.deletedAt.toISOString() : null,
  };
}

type MachineColumns = Omit<MachineBody, "modes">;

function columnsOf(body: MachineBody): MachineColumns {
  const { modes: _modes, ...columns } = body;
  return columns;
}

async function modesOf(machineIds: string[], tx?: Tx): Promise<Map<string, MachineModeModel[]>> {
  const byMachine = new Map<string, MachineModeModel[]>(machineIds.map((id) => [id, []]));
  if (machineIds.length === 0) return byMachine;
  const modes = await MachineModeModel.findAll({
    where: { machineId: machineIds },
    order: [
      ["direction", "ASC"],
      ["frequencyHz", "ASC"],
      ["id", "ASC"],
    ],
    transaction: tx ?? null,
  });
  for (const mode of modes) byMachine.get(mode.machineId)?.push(mode);
  return byMachine;
}

/** Each machine's measured stiffness map: one point per dial-indicator reading (oldest first). */
async function stiffnessPointsOf(machineIds: string[], tx?: Tx): Promise<Map<string, MachineStiffnessPoint[]>> {
  const byMachine = new Map<string, MachineStiffnessPoint[]>(machineIds.map((id) => [id, []]));
  if (machineIds.length === 0) return byMachine;
  const rows = await getSequelize().query<{ machine_id: string; x_mm: number; y_mm: number; direction: Axis; stiffness_n_per_mm: number }>(
    `SELECT machine_id, x_mm, y_mm, direction, stiffness_n_per_mm FROM stiffness_readings
      WHERE machine_id IN (:machineIds) ORDER BY measured_at, created_at, id`,
    { replacements: { machineIds }, type: QueryTypes.SELECT, transaction: tx ?? null },
  );
  for (const r of rows) {
    byMachine.get(r.machine_id)?.push({ xMm: r.x_mm, yMm: r.y_mm, direction: r.direction, stiffnessNPerMm: r.stiffness_n_per_mm });
  }
  return byMachine;
}

export async function listMachines(shopId: string, query: MachineListQuery): Promise<{ items: Machine[]; total: number }> {
  const and: WhereOptions[] = [{ shopId }, { deletedAt: query.deleted ? { [Op.ne]: null } : null }];
  if (query.kind) and.push({ kind: query.kind });
  if (query.q) and.push({ name: { [Op.iLike]: likePattern(query.q) } });
  const { rows, count } = await MachineModel.findAndCountAll({
    where: { [Op.and]: and },
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const ids = rows.map((r) => r.id);
  const [modes, points] = await Promise.all([modesOf(ids), stiffnessPointsOf(ids)]);
  return { items: rows.map((r) => toMachine(r, modes.get(r.id) ?? [], points.get(r.id) ?? [])), total: count };
}

/** The shop's machine (in the bin or not) with its modes, or null. */
export async function findMachine(shopId: string, id: string, tx?: Tx, lock = false): Promise<Machine | null> {
  const row = await MachineModel.findOne({
    where: { id, shopId },
    transaction: tx ?? null,
    ...(tx && lock ? { lock: tx.LOCK.UPDATE } : {}),
  });
  if (!row) return null;
  const modes = (await modesOf([row.id], tx)).get(row.id) ?? [];
  const points = (await stiffnessPointsOf([row.id], tx)).get(row.id) ?? [];
  return toMachine(row, modes, points);
}

/**
 * Replaces the machine's whole mode set (the caller's transaction keeps it all-or-nothing). A mode
 * sent back unchanged keeps what the form does not carry: its measurement date, the recording it
 * was accepted from and the mass it was estimated with.
 */
export async function replaceModes(shopId: string, machineId: string, modes: MachineMode[], tx: Tx): Promise<void> {
  type Kept = { direction: string; frequency_hz: number; damping_ratio: number; stiffness_n_per_mm: number; source: string; recording_id: string | null; mass_kg: number | null; measured_at: Date };
  const before = await getSequelize().query<Kept>(
    `SELECT direction, frequency_hz, damping_ratio, stiffness_n_per_mm, source, recording_id, mass_kg, measured_at
       FROM machine_modes WHERE shop_id = :shopId AND machine_id = :machineId`,
    { replacements: { shopId, machineId }, type: QueryTypes.SELECT, transaction: tx },
  );
  await MachineModeModel.destroy({ where: { shopId, machineId }, transaction: tx });
  if (modes.length === 0) return;
  const created = await MachineModeModel.bulkCreate(
    modes.map((m) => ({ ...m, shopId, machineId })),
    { transaction: tx, returning: true },
  );
  for (const row of created) {
    const i = before.findIndex(
      (b) =>
        b.direction === row.direction &&
        b.frequency_hz === row.frequencyHz &&
        b.damping_ratio === row.dampingRatio &&
        b.stiffness_n_per_mm === row.stiffnessNPerMm &&
        b.source === row.source,
    );
    if (i < 0) continue;
    const [kept] = before.splice(i, 1);
    await getSequelize().query(`UPDATE machine_modes SET recording_id = :recordingId, mass_kg = :massKg, measured_at = :measuredAt WHERE id = :id`, {
      replacements: { recordingId: kept!.recording_id, massKg: kept!.mass_kg, measuredAt: kept!.measured_at, id: row.id },
      transaction: tx,
    });
  }
}

export async function insertMachine(shopId: string, body: MachineBody, tx: Tx, id?: string): Promise<Machine> {
  const row = await MachineModel.create({ ...(id ? { id } : {}), shopId, ...columnsOf(body) }, { transaction: tx });
  await replaceModes(shopId, row.id, body.modes, tx);
  const created = await findMachine(shopId, row.id, tx);
  if (!created) throw new Error("machine vanished after insert");
  return created;
}

export async function updateMachine(
  shopId: string,
  id: string,
  changes: Partial<MachineColumns> & { deletedAt?: Date | null },
  tx: Tx,
): Promise<void> {
  const row = await MachineModel.findOne({ where: { id, shopId }, transaction: tx });
  if (!row) return;
  // A replaced mode set alone still counts as an edit of the machine.
  row.changed("updatedAt", true);
  await row.update(changes, { transaction: tx });
}

/** How many assemblies and recipes (not deleted) are on the machine. */
export async function countMachineReferences(
  shopId: string,
  id: string,
  tx?: Tx,
): Promise<{ recipes: number; assemblies: number }> {
  const [rows] = await getSequelize().query(
    `SELECT (SELECT count(*) FROM recipes WHERE shop_id = $1 AND machine_id = $2 AND deleted_at IS NULL) AS recipes,
            (SELECT count(*) FROM assemblies WHERE shop_id = $1 AND machine_id = $2 AND deleted_at IS NULL) AS assemblies`,
    { bind: [shopId, id], transaction: tx ?? null },
  );
  return rows[0] as { recipes: number; assemblies: number };
}

/** Flags the shop's recipes on the machine for a re-check after its limits changed. */
export async function flagRecipesOfMachine(shopId: string, id: string, tx?: Tx): Promise<void> {
  await getSequelize().query(
    "UPDATE recipes SET needs_recheck = true WHERE shop_id = $1 AND machine_id = $2 AND deleted_at IS NULL",
    { bind: [shopId, id], transaction: tx ?? null },
  );
}
