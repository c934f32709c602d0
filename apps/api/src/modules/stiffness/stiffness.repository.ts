import type { Axis, StiffnessReading, StiffnessReadingBody } from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import { StiffnessReadingModel } from "./stiffness-reading.model.js";

const toReading = (r: StiffnessReadingModel): StiffnessReading => ({
  id: r.id,
  machineId: r.machineId,
  xMm: r.xMm,
  yMm: r.yMm,
  zMm: r.zMm,
  direction: r.direction,
  forceN: r.forceN,
  deflectionMm: r.deflectionMm,
  stiffnessNPerMm: r.stiffnessNPerMm,
  note: r.note,
  measuredAt: r.measuredAt.toISOString(),
  createdAt: r.createdAt.toISOString(),
});

/** The machine's readings, newest measurement first (optionally one direction). */
export async function listStiffnessReadings(shopId: string, machineId: string, direction?: Axis, tx?: Tx): Promise<StiffnessReading[]> {
  const rows = await StiffnessReadingModel.findAll({
    where: { shopId, machineId, ...(direction ? { direction } : {}) },
    order: [
      ["measuredAt", "DESC"],
      ["createdAt", "DESC"],
      ["id", "ASC"],
    ],
    transaction: tx ?? null,
  });
  return rows.map(toReading);
}

export async function insertStiffnessReading(
  shopId: string,
  machineId: string,
  body: Omit<StiffnessReadingBody, "measuredAt"> & { measuredAt: Date },
  createdBy: string | null,
  tx: Tx,
): Promise<StiffnessReading> {
  const row = await StiffnessReadingModel.create({ shopId, machineId, ...body, createdBy }, { transaction: tx, returning: true });
  return toReading(row);
}

export async function findStiffnessReading(shopId: string, machineId: string, id: string, tx?: Tx): Promise<StiffnessReading | null> {
  const row = await StiffnessReadingModel.findOne({ where: { id, shopId, machineId }, transaction: tx ?? null });
  return row ? toReading(row) : null;
}

export async function deleteStiffnessReading(shopId: string, machineId: string, id: string, tx: Tx): Promise<void> {
  await StiffnessReadingModel.destroy({ where: { id, shopId, machineId }, transaction: tx });
}
