import type { Axis, BacklashReading, BacklashReadingBody, BacklashReadingMutation, Machine } from "@ringdown/contracts";
import { inTransaction, type Tx } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { updateMachine } from "../machines/machines.repository.js";
import { machineForRead, machineForUpdate, measurementDate } from "../vibration/machine-access.js";
import { applyRecheck, valueChange } from "../vibration/recheck.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import {
  deleteBacklashReading,
  findBacklashReading,
  insertBacklashReading,
  latestBacklashReading,
  listBacklashReadings,
} from "./backlash.repository.js";

/** Sets the machine's axis backlash to the axis's latest reading (unchanged when none is left). */
async function followLatest(shopId: string, machine: Machine, axis: Axis, reading: BacklashReading, tx: Tx): Promise<BacklashReadingMutation> {
  const latest = await latestBacklashReading(shopId, machine.id, axis, tx);
  const before = machine.axes[axis].backlashMm;
  const after = latest ? latest.backlashMm : before;
  const field = `axes.${axis}.backlashMm`;
  const estimatedFields = latest ? machine.estimatedFields.filter((f) => f !== field) : machine.estimatedFields;
  const axesAfter = { ...machine.axes, [axis]: { ...machine.axes[axis], backlashMm: after } };
  if (after !== before || estimatedFields.length !== machine.estimatedFields.length) {
    await updateMachine(shopId, machine.id, { axes: axesAfter, estimatedFields }, tx);
  }
  const outcome = await applyRecheck(shopId, machine.id, [valueChange("backlash", axis, before, after, "mm")], tx);
  return { reading, ...outcome, machineBacklashMm: { x: axesAfter.x.backlashMm, y: axesAfter.y.backlashMm, z: axesAfter.z.backlashMm } };
}

export async function listBacklash(shopId: string, machineId: string): Promise<{ items: BacklashReading[] }> {
  await machineForRead(shopId, machineId);
  return { items: await listBacklashReadings(shopId, machineId) };
}

/** How a reading is named in the audit log. */
function readingEvent(machine: Machine, r: BacklashReading) {
  return {
    subject: { type: "backlash_reading" as const, id: r.id, label: `${machine.name}: ${r.axis.toUpperCase()} axis` },
    detail: { machineId: machine.id, axis: r.axis, backlashMm: r.backlashMm },
  };
}

export async function addBacklash(shopId: string, machineId: string, body: BacklashReadingBody, actor: AuditActor & { userId: string }): Promise<BacklashReadingMutation> {
  const measuredAt = measurementDate(body.measuredAt);
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    const reading = await insertBacklashReading(shopId, machineId, { ...body, measuredAt }, actor.userId, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "backlash_reading.added", ...readingEvent(machine, reading) });
    return followLatest(shopId, machine, reading.axis, reading, tx);
  });
}

export async function removeBacklash(shopId: string, machineId: string, id: string, actor: AuditActor): Promise<BacklashReadingMutation> {
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    const reading = await findBacklashReading(shopId, machineId, id, tx);
    if (!reading) throw AppError.notFound("Backlash reading not found.");
    await deleteBacklashReading(shopId, machineId, id, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "backlash_reading.deleted", ...readingEvent(machine, reading) });
    return followLatest(shopId, machine, reading.axis, reading, tx);
  });
}
