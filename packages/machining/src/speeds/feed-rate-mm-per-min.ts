import { requirePositive, requirePositiveInteger } from "../internal/require.js";

/**
 * Table feed rate from the feed per tooth (chip load).
 *
 * vf = fz · z · n
 *
 * @param input.rpm n, spindle speed [rpm]
 * @param input.flutes z, number of cutting edges [-] (integer >= 1)
 * @param input.chipLoadMm fz, programmed feed per tooth [mm]
 * @returns vf [mm/min]
 * @throws RangeError for non-positive speed or chip load, or a flute count that is not an integer >= 1
 * @source Machinery's Handbook / SME "Useful formulas for machining" (F = ft · nt · N).
 * @example feedRateMmPerMin({ rpm: 18000, flutes: 2, chipLoadMm: 0.05 }) // 1800 mm/min
 */
export function feedRateMmPerMin(input: { rpm: number; flutes: number; chipLoadMm: number }): number {
  const { rpm, flutes, chipLoadMm } = input;
  requirePositive("feedRateMmPerMin", "rpm", rpm);
  requirePositiveInteger("feedRateMmPerMin", "flutes", flutes);
  requirePositive("feedRateMmPerMin", "chipLoadMm", chipLoadMm);
  return chipLoadMm * flutes * rpm;
}
