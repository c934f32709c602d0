import type { Axis, BacklashReading, BacklashReadingBody } from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import { BacklashReadingModel } from "./backlash-reading.model.js";

const toReading = (r: BacklashReadingModel): BacklashReading => ({
  id: r.id,
  machineId: r.machineId,
  axis: r.axis,
  backlashMm: r.backlashMm,
  note: r.note,
  measuredAt: r.measuredAt.toISOString(),
  createdAt: r.createdAt.toISOString(),
});

const NEWEST_FIRST: Array<[string, string]> = [
  ["measuredAt", "DESC"],
  ["createdAt", "DESC"],
  ["id", "ASC"],
];

export async function listBacklashReadings(shopId: string, machineId: string): Promise<BacklashReading[]> {
  const rows = await BacklashReadingModel.findAll({ where: { shopId, machineId }, order: NEWEST_FIRST });
  return rows.map(toReading);
}

/** The axis's most recent reading (by measurement date, then entry time), or null. */
export async function latestBacklashReading(shopId: string, machineId: string, axis: Axis, tx: Tx): Promise<BacklashReading | null> {
  const row = await BacklashReadingModel.findOne({ where: { shopId, machineId, axis }, order: NEWEST_FIRST, transaction: tx });
  return row ? toReading(row) : null;
}

export async function insertBacklashReading(
  shopId: string,
  machineId: string,
  body: Omit<BacklashReadingBody, "measuredAt"> & { measuredAt: Date },
  createdBy: string | null,
  tx: Tx,
): Promise<BacklashReading> {
  return toReading(await BacklashReadingModel.create({ shopId, machineId, ...body, createdBy }, { transaction: tx }));
}

export async function findBacklashReading(shopId: string, machineId: string, id: string, tx: Tx): Promise<BacklashReading | null> {
  const row = await BacklashReadingModel.findOne({ where: { id, shopId, machineId }, transaction: tx });
  return row ? toReading(row) : null;
}

export async function deleteBacklashReading(shopId: string, machineId: string, id: string, tx: Tx): Promise<void> {
  await BacklashReadingModel.destroy({ where: { id, shopId, machineId }, transaction: tx });
}
