import { RECHECK_THRESHOLD_PCT, type Axis, type RecheckOutcome, type VibrationChange } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";

/** |after − before| / before × 100 [%]. */
export function changePct(before: number, after: number): number {
  return (Math.abs(after - before) / Math.abs(before)) * 100;
}

/** A measured quantity that moved from `before` to `after`; material when it moved by more than the threshold. */
export function valueChange(
  what: "stiffness" | "backlash" | "mode_frequency" | "mode_stiffness",
  direction: Axis,
  before: number,
  after: number,
  unit: VibrationChange["unit"],
): VibrationChange {
  // Backlash may start at 0: any change from nothing is material.
  const pct = before === 0 ? (after === 0 ? 0 : null) : changePct(before, after);
  return { what, direction, before, after, changePct: pct, unit, material: pct === null ? true : pct > RECHECK_THRESHOLD_PCT };
}

/** A mode that appeared or disappeared always changes the machine's dynamics materially. */
export function modePresenceChange(what: "mode_added" | "mode_removed", direction: Axis, frequencyHz: number): VibrationChange {
  return {
    what,
    direction,
    before: what === "mode_added" ? null : frequencyHz,
    after: what === "mode_added" ? frequencyHz : null,
    changePct: null,
    unit: "Hz",
    material: true,
  };
}

/**
 * Marks every (not deleted) recipe on the machine for a re-check — one UPDATE — when at least one
 * change is material, and says how many recipes that touched.
 */
export async function applyRecheck(shopId: string, machineId: string, changes: VibrationChange[], tx: Tx): Promise<RecheckOutcome> {
  if (!changes.some((c) => c.material)) return { changes, recipesFlagged: 0 };
  return { changes, recipesFlagged: await flagMachineRecipes(shopId, machineId, tx) };
}

/** Marks every (not deleted) recipe on the machine for a re-check in one UPDATE; returns how many. */
export async function flagMachineRecipes(shopId: string, machineId: string, tx: Tx): Promise<number> {
  const [rows] = await getSequelize().query(
    `UPDATE recipes SET needs_recheck = true
      WHERE shop_id = $1 AND machine_id = $2 AND deleted_at IS NULL
      RETURNING id`,
    { bind: [shopId, machineId], transaction: tx },
  );
  return (rows as unknown[]).length;
}
