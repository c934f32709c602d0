import type { Machine } from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { findMachine } from "../machines/machines.repository.js";

/** The shop's machine for reading its profile (a machine in the bin can still be read). */
export async function machineForRead(shopId: string, machineId: string, tx?: Tx): Promise<Machine> {
  const machine = await findMachine(shopId, machineId, tx);
  if (!machine) throw AppError.notFound("Machine not found.");
  return machine;
}

/**
 * The shop's machine, row-locked for the rest of the transaction, for changing its profile: two
 * readings saved at once then recompute the machine's stiffness one after the other.
 */
export async function machineForUpdate(shopId: string, machineId: string, tx: Tx): Promise<Machine> {
  const machine = await findMachine(shopId, machineId, tx, true);
  if (!machine) throw AppError.notFound("Machine not found.");
  if (machine.deletedAt) throw AppError.conflict("This machine is deleted; restore it before changing its measurements.");
  return machine;
}

/** A "YYYY-MM-DD" or ISO date-time as a Date; refuses dates in the future (a day of slack for time zones). */
export function measurementDate(value: string, field = "measuredAt"): Date {
  const date = /^\d{4}-\d{2}-\d{2}$/.test(value) ? new Date(`${value}T12:00:00Z`) : new Date(value);
  if (Number.isNaN(date.getTime())) throw AppError.validation("Some fields need attention.", { [field]: "Enter a valid date" });
  if (date.getTime() > Date.now() + 24 * 3600_000) {
    throw AppError.validation("Some fields need attention.", { [field]: "The measurement date cannot be in the future" });
  }
  return date;
}
