import { assertCanAddMachine } from "../billing/billing.service.js";
import {
  machineBodySchema,
  type Machine,
  type MachineBody,
  type MachineKind,
  type MachineListQuery,
  type MachinePage,
  type MachinePatchBody,
} from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { machineDefaults } from "./machine-defaults.js";
import { changedFields, recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import {
  countMachineReferences,
  findMachine,
  flagRecipesOfMachine,
  insertMachine,
  listMachines,
  replaceModes,
  updateMachine,
} from "./machines.repository.js";

export async function listShopMachines(shopId: string, query: MachineListQuery): Promise<MachinePage> {
  const { items, total } = await listMachines(shopId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getMachine(shopId: string, id: string): Promise<Machine> {
  const machine = await findMachine(shopId, id);
  if (!machine) throw AppError.notFound("Machine not found.");
  return machine;
}

export function defaultsForKind(kind: MachineKind): MachineBody {
  return machineDefaults(kind);
}

/** The subject of a machine's audit events (ceilings and profile changes name the machine too). */
export const machineSubject = (m: Pick<Machine, "id" | "name">) => ({ type: "machine" as const, id: m.id, label: m.name });

export function createMachine(shopId: string, body: MachineBody, actor: AuditActor): Promise<Machine> {
  return inTransaction(async (tx) => {
    // The free plan includes one machine; the billing service says so in words when it is used up.
    await assertCanAddMachine(shopId, tx);
    const created = await insertMachine(shopId, body, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "machine.created", subject: machineSubject(created), detail: { kind: created.kind } });
    return created;
  });
}

function bodyOf(m: Machine): MachineBody {
  const { id: _i, shopId: _s, createdAt: _c, updatedAt: _u, deletedAt: _d, ...body } = m;
  return body;
}

/** The value at a dot path ("axes.x.stiffnessNPerMm", "modes.0") of a machine body. */
function valueAt(body: MachineBody, path: string): unknown {
  let value: unknown = body;
  for (const key of path.split(".")) {
    if (value === null || typeof value !== "object") return undefined;
    value = (value as Record<string, unknown>)[key];
  }
  return value;
}

/**
 * A value someone typed over is no longer the kind's estimate: unless the patch sends its own
 * `estimatedFields`, paths whose value changed drop out of the list.
 */
function remainingEstimates(before: MachineBody, after: MachineBody): string[] {
  return before.estimatedFields.filter(
    (path) => JSON.stringify(valueAt(before, path)) === JSON.stringify(valueAt(after, path)),
  );
}

/**
 * Changes the fields sent. `modes`, when sent, replaces the machine's whole mode set; the machine
 * and its modes change together or not at all.
 */
export async function patchMachine(shopId: string, id: string, patch: MachinePatchBody, actor: AuditActor): Promise<Machine> {
  return inTransaction(async (tx) => {
    const current = await findMachine(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Machine not found.");
    if (current.deletedAt) throw AppError.conflict("This machine is deleted; restore it before editing it.");
    const before = bodyOf(current);
    const merged = machineBodySchema.parse({ ...before, ...patch });
    if (patch.estimatedFields === undefined) merged.estimatedFields = remainingEstimates(before, merged);
    const { modes, ...columns } = merged;
    await updateMachine(shopId, id, columns, tx);
    if (patch.modes !== undefined) await replaceModes(shopId, id, modes, tx);
    const { name: _n, notes: _no, estimatedFields: _e, ...limits } = patch;
    if (Object.keys(limits).length > 0) await flagRecipesOfMachine(shopId, id, tx);
    const updated = await findMachine(shopId, id, tx);
    if (!updated) throw AppError.notFound("Machine not found.");
    const fields = changedFields<MachineBody>(patch, before);
    if (fields.length > 0) await recordAuditEvent(tx, { shopId, actor, action: "machine.updated", subject: machineSubject(updated), detail: { fields } });
    return updated;
  });
}

/** Soft delete; refused while assemblies or recipes are on the machine. */
export async function deleteMachine(shopId: string, id: string, actor: AuditActor): Promise<void> {
  await inTransaction(async (tx) => {
    const current = await findMachine(shopId, id, tx, true);
    if (!current || current.deletedAt) throw AppError.notFound("Machine not found.");
    const refs = await countMachineReferences(shopId, id, tx);
    if (refs.assemblies + refs.recipes > 0) {
      const a = `${refs.assemblies} cutter ${refs.assemblies === 1 ? "assembly" : "assemblies"}`;
      const r = `${refs.recipes} ${refs.recipes === 1 ? "recipe" : "recipes"}`;
      throw AppError.conflict(`This machine has ${a} and ${r}; delete or move those before deleting the machine.`);
    }
    await updateMachine(shopId, id, { deletedAt: new Date() }, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "machine.deleted", subject: machineSubject(current) });
  });
}

export async function restoreMachine(shopId: string, id: string, actor: AuditActor): Promise<Machine> {
  return inTransaction(async (tx) => {
    const current = await findMachine(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Machine not found.");
    if (!current.deletedAt) return current;
    // A restored machine counts against the plan like a new one.
    await assertCanAddMachine(shopId, tx);
    await updateMachine(shopId, id, { deletedAt: null }, tx);
    const restored = await findMachine(shopId, id, tx);
    if (!restored) throw AppError.notFound("Machine not found.");
    await recordAuditEvent(tx, { shopId, actor, action: "machine.restored", subject: machineSubject(restored) });
    return restored;
  });
}
