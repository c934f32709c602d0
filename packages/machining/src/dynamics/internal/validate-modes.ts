import { requireInClosedRange, requireNonNegative, requirePositive, requirePositiveInteger } from "../../internal/require.js";
import type { MillingDirection } from "../../forces/immersion-angles-rad.js";
import type { Mode } from "../mode.js";

/** Checks a list of modes; every field named in the error as modes[i].field. */
export function validateModes(fn: string, modes: readonly Mode[]): void {
  if (!Array.isArray(modes) || modes.length === 0) throw new RangeError(`${fn} requires modes to hold at least one mode`);
  modes.forEach((m, i) => {
    if (m.direction !== "x" && m.direction !== "y") throw new RangeError(`${fn} requires modes[${i}].direction to be "x" or "y"`);
    requirePositive(fn, `modes[${i}].frequencyHz`, m.frequencyHz);
    requirePositive(fn, `modes[${i}].stiffnessNPerMm`, m.stiffnessNPerMm);
    requirePositive(fn, `modes[${i}].dampingRatio`, m.dampingRatio);
    if (!(m.dampingRatio < 1)) throw new RangeError(`${fn} requires modes[${i}].dampingRatio < 1`);
  });
}

/** Checks the cut parameters shared by the stability functions. */
export function validateCut(
  fn: string,
  input: { flutes: number; radialImmersion: number; specificForceNPerMm2: number; radialForceRatio: number; millingDirection?: MillingDirection },
): void {
  requirePositiveInteger(fn, "flutes", input.flutes);
  requireInClosedRange(fn, "radialImmersion", input.radialImmersion, Number.MIN_VALUE, 1);
  requirePositive(fn, "specificForceNPerMm2", input.specificForceNPerMm2);
  requireNonNegative(fn, "radialForceRatio", input.radialForceRatio);
  const d = input.millingDirection;
  if (d !== undefined && d !== "climb" && d !== "conventional") {
    throw new RangeError(`${fn} requires millingDirection to be "climb" or "conventional"`);
  }
}
