import type { z } from "zod";
import type { Axis, MachineModeList, MachineModeRecord, ModeMutation, ModePatchBody, VibrationChange, modeBodySchema } from "@ringdown/contracts";
import { modeFromMassStiffness, naturalFrequencyHz } from "@ringdown/machining";
import { inTransaction, type Tx } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { machineForRead, machineForUpdate, measurementDate } from "../vibration/machine-access.js";
import { applyRecheck, modePresenceChange, valueChange } from "../vibration/recheck.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { deleteMode, findMode, insertMode, listModes, touchMachine, updateMode, type NewMode } from "./modes.repository.js";

/** Same limit as the machine record's mode list. */
export const MAX_MODES_PER_MACHINE = 40;

/**
 * How a new (or moved) mode compares with the machine's modes in the same direction: against the
 * nearest in frequency (on a log scale) its frequency and stiffness changes; with none there, it is
 * a new mode.
 */
export function compareWithExisting(mode: Pick<NewMode, "direction" | "frequencyHz" | "stiffnessNPerMm">, existing: MachineModeRecord[]): VibrationChange[] {
  const same = existing.filter((m) => m.direction === mode.direction);
  if (same.length === 0) return [modePresenceChange("mode_added", mode.direction, mode.frequencyHz)];
  const nearest = same.reduce((a, b) =>
    Math.abs(Math.log(b.frequencyHz / mode.frequencyHz)) < Math.abs(Math.log(a.frequencyHz / mode.frequencyHz)) ? b : a,
  );
  return [
    valueChange("mode_frequency", mode.direction, nearest.frequencyHz, mode.frequencyHz, "Hz"),
    valueChange("mode_stiffness", mode.direction, nearest.stiffnessNPerMm, mode.stiffnessNPerMm, "N/mm"),
  ];
}

/** Adds a mode in the caller's transaction (shared with accept-mode) and applies the re-check rule. */
export async function addModeInTx(shopId: string, machineId: string, mode: NewMode, tx: Tx): Promise<ModeMutation> {
  const existing = await listModes(shopId, machineId, tx);
  if (existing.length >= MAX_MODES_PER_MACHINE) {
    throw AppError.conflict(`A machine holds at most ${MAX_MODES_PER_MACHINE} modes; delete one before adding another.`);
  }
  const changes = compareWithExisting(mode, existing);
  const created = await insertMode(shopId, machineId, mode, tx);
  await touchMachine(shopId, machineId, tx);
  return { mode: created, ...(await applyRecheck(shopId, machineId, changes, tx)) };
}

type ParsedModeBody = z.output<typeof modeBodySchema>;

/** How a mode is named in the audit log. */
function modeSubject(machineName: string, mode: MachineModeRecord) {
  return { type: "mode" as const, id: mode.id, label: `${machineName}: ${mode.direction.toUpperCase()} ${Number(mode.frequencyHz.toPrecision(4))} Hz` };
}
const modeFacts = (m: Pick<MachineModeRecord, "direction" | "frequencyHz" | "dampingRatio" | "stiffnessNPerMm" | "source">) => ({
  direction: m.direction,
  frequencyHz: m.frequencyHz,
  dampingRatio: m.dampingRatio,
  stiffnessNPerMm: m.stiffnessNPerMm,
  source: m.source,
});

export async function listMachineModes(shopId: string, machineId: string): Promise<MachineModeList> {
  await machineForRead(shopId, machineId);
  return { items: await listModes(shopId, machineId) };
}

export async function createMode(shopId: string, machineId: string, body: ParsedModeBody, actor: AuditActor): Promise<ModeMutation> {
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    let mode: NewMode;
    if (body.source === "estimated") {
      // Mass–spring estimate: fn = √(k/m)/2π with the given stiffness, else the machine's in that direction.
      const stiffnessNPerMm = body.stiffnessNPerMm ?? machine.axes[body.direction].stiffnessNPerMm;
      const frequencyHz =
        body.direction === "z"
          ? naturalFrequencyHz({ stiffnessNPerMm, massKg: body.massKg })
          : modeFromMassStiffness({ massKg: body.massKg, stiffnessNPerMm, dampingRatio: body.dampingRatio, direction: body.direction }).frequencyHz;
      const basis = body.stiffnessNPerMm === undefined ? `the machine's ${body.direction.toUpperCase()} stiffness` : "the given stiffness";
      mode = {
        direction: body.direction,
        frequencyHz,
        dampingRatio: body.dampingRatio,
        stiffnessNPerMm,
        source: "estimated",
        note: body.note || `Estimated from ${body.massKg} kg on ${basis} (${Math.round(stiffnessNPerMm)} N/mm)`,
        massKg: body.massKg,
        recordingId: null,
        measuredAt: new Date(),
      };
    } else {
      mode = {
        direction: body.direction,
        frequencyHz: body.frequencyHz,
        dampingRatio: body.dampingRatio,
        stiffnessNPerMm: body.stiffnessNPerMm,
        source: body.source,
        note: body.note,
        massKg: null,
        recordingId: null,
        measuredAt: body.measuredAt ? measurementDate(body.measuredAt) : new Date(),
      };
    }
    const added = await addModeInTx(shopId, machineId, mode, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "mode.added",
      subject: modeSubject(machine.name, added.mode),
      detail: { machineId, ...modeFacts(added.mode) },
    });
    return added;
  });
}

export async function patchMode(shopId: string, machineId: string, id: string, patch: ModePatchBody, actor: AuditActor): Promise<ModeMutation> {
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    const current = await findMode(shopId, machineId, id, tx);
    if (!current) throw AppError.notFound("Mode not found.");
    const next: NewMode = {
      direction: patch.direction ?? current.direction,
      frequencyHz: patch.frequencyHz ?? current.frequencyHz,
      dampingRatio: patch.dampingRatio ?? current.dampingRatio,
      stiffnessNPerMm: patch.stiffnessNPerMm ?? current.stiffnessNPerMm,
      source: patch.source ?? current.source,
      note: patch.note ?? current.note,
      // A mass only describes an estimate whose numbers were not overwritten.
      massKg: patch.frequencyHz !== undefined || patch.stiffnessNPerMm !== undefined || (patch.source && patch.source !== "estimated") ? null : current.massKg,
      recordingId: current.recordingId,
      measuredAt: patch.measuredAt ? measurementDate(patch.measuredAt) : new Date(current.measuredAt),
    };
    const changes: VibrationChange[] =
      next.direction === current.direction
        ? [
            valueChange("mode_frequency", next.direction, current.frequencyHz, next.frequencyHz, "Hz"),
            valueChange("mode_stiffness", next.direction, current.stiffnessNPerMm, next.stiffnessNPerMm, "N/mm"),
          ]
        : [modePresenceChange("mode_removed", current.direction, current.frequencyHz), modePresenceChange("mode_added", next.direction, next.frequencyHz)];
    const mode = await updateMode(shopId, machineId, id, next, tx);
    await touchMachine(shopId, machineId, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "mode.updated",
      subject: modeSubject(machine.name, mode),
      detail: { machineId, before: modeFacts(current), after: modeFacts(mode) },
    });
    return { mode, ...(await applyRecheck(shopId, machineId, changes, tx)) };
  });
}

export async function removeMode(shopId: string, machineId: string, id: string, actor: AuditActor): Promise<ModeMutation> {
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    const current = await findMode(shopId, machineId, id, tx);
    if (!current) throw AppError.notFound("Mode not found.");
    await deleteMode(shopId, machineId, id, tx);
    await touchMachine(shopId, machineId, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "mode.deleted",
      subject: modeSubject(machine.name, current),
      detail: { machineId, ...modeFacts(current) },
    });
    const direction: Axis = current.direction;
    return { mode: current, ...(await applyRecheck(shopId, machineId, [modePresenceChange("mode_removed", direction, current.frequencyHz)], tx)) };
  });
}
