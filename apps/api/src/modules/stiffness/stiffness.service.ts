import {
  axes,
  type Axis,
  type Machine,
  type StiffnessMap,
  type StiffnessReading,
  type StiffnessReadingBody,
  type StiffnessReadingList,
  type StiffnessReadingMutation,
} from "@ringdown/contracts";
import { stiffnessGrid, type StiffnessPoint } from "@ringdown/machining";
import { inTransaction, type Tx } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { updateMachine } from "../machines/machines.repository.js";
import { machineForRead, machineForUpdate, measurementDate } from "../vibration/machine-access.js";
import { applyRecheck, valueChange } from "../vibration/recheck.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { deleteStiffnessReading, findStiffnessReading, insertStiffnessReading, listStiffnessReadings } from "./stiffness.repository.js";

const pointsOf = (readings: StiffnessReading[]): StiffnessPoint[] =>
  readings.map((r) => ({ xMm: r.xMm, yMm: r.yMm, stiffnessNPerMm: r.stiffnessNPerMm, direction: r.direction }));

/**
 * The machine's single stiffness in a direction from its readings: the worst case over the map,
 * i.e. the softest measured position (repeated positions averaged on compliance). Null without readings.
 */
export function worstCaseStiffness(readings: StiffnessReading[], direction: Axis, machine: Pick<Machine, "axes">): number | null {
  const own = readings.filter((r) => r.direction === direction);
  if (own.length === 0) return null;
  return stiffnessGrid({
    points: pointsOf(own),
    direction,
    widthXMm: machine.axes.x.travelMm,
    widthYMm: machine.axes.y.travelMm,
    cellsX: 2,
    cellsY: 2,
  }).worstCaseNPerMm;
}

/** A reading's position must lie inside the machine's work envelope (0 … travel on each axis). */
function checkEnvelope(body: StiffnessReadingBody, machine: Machine): void {
  const fields: Record<string, string> = {};
  const check = (field: "xMm" | "yMm" | "zMm", axis: Axis) => {
    const travel = machine.axes[axis].travelMm;
    if (body[field] > travel) fields[field] = `Position ${axis.toUpperCase()} must be within the ${axis.toUpperCase()} travel, 0–${travel} mm`;
  };
  check("xMm", "x");
  check("yMm", "y");
  check("zMm", "z");
  if (Object.keys(fields).length > 0) throw AppError.validation("The position lies outside the machine's work envelope.", fields);
}

/**
 * Brings the machine's stiffness in `direction` in line with its readings (the worst case over the
 * map) and marks the field as measured. Without readings left the machine keeps its value.
 */
async function followReadings(shopId: string, machine: Machine, direction: Axis, tx: Tx) {
  const readings = await listStiffnessReadings(shopId, machine.id, direction, tx);
  const before = machine.axes[direction].stiffnessNPerMm;
  const after = worstCaseStiffness(readings, direction, machine) ?? before;
  const field = `axes.${direction}.stiffnessNPerMm`;
  const axesAfter = { ...machine.axes, [direction]: { ...machine.axes[direction], stiffnessNPerMm: after } };
  const estimatedFields = readings.length > 0 ? machine.estimatedFields.filter((f) => f !== field) : machine.estimatedFields;
  if (after !== before || estimatedFields.length !== machine.estimatedFields.length) {
    await updateMachine(shopId, machine.id, { axes: axesAfter, estimatedFields }, tx);
  }
  const outcome = await applyRecheck(shopId, machine.id, [valueChange("stiffness", direction, before, after, "N/mm")], tx);
  const machineStiffnessNPerMm = { x: axesAfter.x.stiffnessNPerMm, y: axesAfter.y.stiffnessNPerMm, z: axesAfter.z.stiffnessNPerMm };
  return { ...outcome, machineStiffnessNPerMm };
}

export async function listReadings(shopId: string, machineId: string): Promise<StiffnessReadingList> {
  await machineForRead(shopId, machineId);
  return { items: await listStiffnessReadings(shopId, machineId) };
}

/** How a reading is named in the audit log. */
function readingEvent(machine: Machine, r: StiffnessReading) {
  return {
    subject: { type: "stiffness_reading" as const, id: r.id, label: `${machine.name}: ${r.direction.toUpperCase()} at X ${r.xMm} mm, Y ${r.yMm} mm` },
    detail: { machineId: machine.id, direction: r.direction, xMm: r.xMm, yMm: r.yMm, zMm: r.zMm, stiffnessNPerMm: r.stiffnessNPerMm },
  };
}

export async function addReading(shopId: string, machineId: string, body: StiffnessReadingBody, actor: AuditActor & { userId: string }): Promise<StiffnessReadingMutation> {
  const measuredAt = measurementDate(body.measuredAt);
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    checkEnvelope(body, machine);
    const reading = await insertStiffnessReading(shopId, machineId, { ...body, measuredAt }, actor.userId, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "stiffness_reading.added", ...readingEvent(machine, reading) });
    return { reading, ...(await followReadings(shopId, machine, reading.direction, tx)) };
  });
}

export async function removeReading(shopId: string, machineId: string, id: string, actor: AuditActor): Promise<StiffnessReadingMutation> {
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    const reading = await findStiffnessReading(shopId, machineId, id, tx);
    if (!reading) throw AppError.notFound("Stiffness reading not found.");
    await deleteStiffnessReading(shopId, machineId, id, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "stiffness_reading.deleted", ...readingEvent(machine, reading) });
    return { reading, ...(await followReadings(shopId, machine, reading.direction, tx)) };
  });
}

/** Per direction, the map sampled on a cells × cells grid over the work envelope, with the readings. */
export async function stiffnessMap(shopId: string, machineId: string, cells: number): Promise<StiffnessMap> {
  const machine = await machineForRead(shopId, machineId);
  const readings = await listStiffnessReadings(shopId, machineId);
  const widthXMm = machine.axes.x.travelMm;
  const widthYMm = machine.axes.y.travelMm;
  const xMm = Array.from({ length: cells }, (_, i) => (i * widthXMm) / (cells - 1));
  const yMm = Array.from({ length: cells }, (_, j) => (j * widthYMm) / (cells - 1));
  const directions = axes.map((direction) => {
    const own = readings.filter((r) => r.direction === direction);
    const machineNPerMm = machine.axes[direction].stiffnessNPerMm;
    if (own.length === 0) {
      return { direction, pointCount: 0, method: null, stiffnessNPerMm: null, minNPerMm: null, maxNPerMm: null, softestAt: null, machineNPerMm, measuredArea: null };
    }
    const grid = stiffnessGrid({ points: pointsOf(own), direction, widthXMm, widthYMm, cellsX: cells, cellsY: cells });
    return {
      direction,
      pointCount: grid.pointCount,
      method: grid.method,
      stiffnessNPerMm: grid.stiffnessNPerMm,
      minNPerMm: grid.minNPerMm,
      maxNPerMm: grid.maxNPerMm,
      softestAt: grid.softestAt,
      machineNPerMm,
      measuredArea: grid.measuredArea,
    };
  });
  return {
    machineId,
    envelope: { xMm: widthXMm, yMm: widthYMm, zMm: machine.axes.z.travelMm },
    xMm,
    yMm,
    basis: "worst_case",
    directions,
    readings,
  };
}
