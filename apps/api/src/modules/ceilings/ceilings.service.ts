import type { Ceilings, CeilingsMutation, Machine, ceilingsBodySchema } from "@ringdown/contracts";
import type { z } from "zod";
import { inTransaction } from "../../db/sequelize.js";
import { updateMachine } from "../machines/machines.repository.js";
import { machineForRead, machineForUpdate } from "../vibration/machine-access.js";
import { flagMachineRecipes } from "../vibration/recheck.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { machineSubject } from "../machines/machines.service.js";

const toCeilings = (m: Machine): Ceilings => ({
  machineId: m.id,
  deflectionCeilingMm: m.deflectionCeilingMm,
  avoidBands: m.avoidBands.map((b) => ({ minHz: b.minHz, maxHz: b.maxHz, note: b.note })),
  modeMarginPct: m.modeMarginPct,
});

export async function getCeilings(shopId: string, machineId: string): Promise<Ceilings> {
  return toCeilings(await machineForRead(shopId, machineId));
}

/**
 * Replaces the machine's ceilings. Any actual change marks the machine's recipes for a re-check,
 * as an edit of the machine's limits does; saving the same values marks nothing.
 */
export async function putCeilings(shopId: string, machineId: string, body: z.output<typeof ceilingsBodySchema>, actor: AuditActor): Promise<CeilingsMutation> {
  return inTransaction(async (tx) => {
    const machine = await machineForUpdate(shopId, machineId, tx);
    const before = toCeilings(machine);
    const after: Ceilings = { machineId, ...body };
    const changed = JSON.stringify(before) !== JSON.stringify(after);
    let recipesFlagged = 0;
    if (changed) {
      await updateMachine(
        shopId,
        machineId,
        {
          deflectionCeilingMm: body.deflectionCeilingMm,
          avoidBands: body.avoidBands,
          modeMarginPct: body.modeMarginPct,
          estimatedFields: machine.estimatedFields.filter((f) => f !== "deflectionCeilingMm" && f !== "modeMarginPct" && !f.startsWith("avoidBands")),
        },
        tx,
      );
      recipesFlagged = await flagMachineRecipes(shopId, machineId, tx);
      const { machineId: _b, ...was } = before;
      const { machineId: _a, ...now } = after;
      await recordAuditEvent(tx, { shopId, actor, action: "machine.ceilings_changed", subject: machineSubject(machine), detail: { before: was, after: now, recipesFlagged } });
    }
    return { ...after, recipesFlagged };
  });
}
