import type { Axis, MachineModeRecord } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";

/*
 * Modes live in machine_modes (the machine's library record reads the same rows). This module
 * also reads the columns the vibration profile added: the moving mass of an estimated mode and the
 * recording a mode was accepted from.
 */

interface ModeRow {
  id: string;
  machine_id: string;
  direction: Axis;
  frequency_hz: number;
  damping_ratio: number;
  stiffness_n_per_mm: number;
  source: MachineModeRecord["source"];
  note: string;
  mass_kg: number | null;
  recording_id: string | null;
  measured_at: Date;
  created_at: Date;
  updated_at: Date;
}

const toMode = (r: ModeRow): MachineModeRecord => ({
  id: r.id,
  machineId: r.machine_id,
  direction: r.direction,
  frequencyHz: r.frequency_hz,
  dampingRatio: r.damping_ratio,
  stiffnessNPerMm: r.stiffness_n_per_mm,
  source: r.source,
  note: r.note,
  massKg: r.mass_kg,
  recordingId: r.recording_id,
  measuredAt: new Date(r.measured_at).toISOString(),
  createdAt: new Date(r.created_at).toISOString(),
  updatedAt: new Date(r.updated_at).toISOString(),
});

const COLUMNS = `id, machine_id, direction, frequency_hz, damping_ratio, stiffness_n_per_mm, source, note, mass_kg,
                 recording_id, measured_at, created_at, updated_at`;

export async function listModes(shopId: string, machineId: string, tx?: Tx): Promise<MachineModeRecord[]> {
  const [rows] = await getSequelize().query(
    `SELECT ${COLUMNS} FROM machine_modes WHERE shop_id = $1 AND machine_id = $2 ORDER BY direction, frequency_hz, id`,
    { bind: [shopId, machineId], transaction: tx ?? null },
  );
  return (rows as ModeRow[]).map(toMode);
}

export async function findMode(shopId: string, machineId: string, id: string, tx?: Tx): Promise<MachineModeRecord | null> {
  const [rows] = await getSequelize().query(`SELECT ${COLUMNS} FROM machine_modes WHERE shop_id = $1 AND machine_id = $2 AND id = $3`, {
    bind: [shopId, machineId, id],
    transaction: tx ?? null,
  });
  const row = (rows as ModeRow[])[0];
  return row ? toMode(row) : null;
}

export interface NewMode {
  direction: Axis;
  frequencyHz: number;
  dampingRatio: number;
  stiffnessNPerMm: number;
  source: MachineModeRecord["source"];
  note: string;
  massKg: number | null;
  recordingId: string | null;
  measuredAt: Date;
}

export async function insertMode(shopId: string, machineId: string, mode: NewMode, tx: Tx): Promise<MachineModeRecord> {
  const [rows] = await getSequelize().query(
    `INSERT INTO machine_modes (shop_id, machine_id, direction, frequency_hz, damping_ratio, stiffness_n_per_mm, source, note,
                                mass_kg, recording_id, measured_at)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11)
     RETURNING ${COLUMNS}`,
    {
      bind: [
        shopId,
        machineId,
        mode.direction,
        mode.frequencyHz,
        mode.dampingRatio,
        mode.stiffnessNPerMm,
        mode.source,
        mode.note,
        mode.massKg,
        mode.recordingId,
        mode.measuredAt,
      ],
      transaction: tx,
    },
  );
  return toMode((rows as ModeRow[])[0]!);
}

export async function updateMode(shopId: string, machineId: string, id: string, mode: NewMode, tx: Tx): Promise<MachineModeRecord> {
  const [rows] = await getSequelize().query(
    `UPDATE machine_modes
        SET direction = $4, frequency_hz = $5, damping_ratio = $6, stiffness_n_per_mm = $7, source = $8, note = $9,
            mass_kg = $10, measured_at = $11, updated_at = now()
      WHERE shop_id = $1 AND machine_id = $2 AND id = $3
      RETURNING ${COLUMNS}`,
    {
      bind: [shopId, machineId, id, mode.direction, mode.frequencyHz, mode.dampingRatio, mode.stiffnessNPerMm, mode.source, mode.note, mode.massKg, mode.measuredAt],
      transaction: tx,
    },
  );
  return toMode((rows as ModeRow[])[0]!);
}

export async function deleteMode(shopId: string, machineId: string, id: string, tx: Tx): Promise<void> {
  await getSequelize().query("DELETE FROM machine_modes WHERE shop_id = $1 AND machine_id = $2 AND id = $3", {
    bind: [shopId, machineId, id],
    transaction: tx,
  });
}

/** Touches the machine so its list and caches see the changed mode set. */
export async function touchMachine(shopId: string, machineId: string, tx: Tx): Promise<void> {
  await getSequelize().query("UPDATE machines SET updated_at = now() WHERE shop_id = $1 AND id = $2", { bind: [shopId, machineId], transaction: tx });
}
