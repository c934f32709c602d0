import { requirePositive } from "../internal/require.js";

/**
 * Material removal rate of a milling cut.
 *
 * Q = ap · ae · vf
 *
 * @param input.axialDepthMm ap [mm]
 * @param input.radialDepthMm ae [mm]
 * @param input.feedMmPerMin vf, table feed [mm/min]
 * @returns Q [mm³/min] (divide by 1000 for cm³/min, by 60 for mm³/s)
 * @throws RangeError if any input is not a finite number > 0
 * @source SME "Useful formulas for machining" (MRR = F · W · t).
 * @example materialRemovalRateMm3PerMin({ axialDepthMm: 5, radialDepthMm: 2, feedMmPerMin: 1800 }) // 18000 mm³/min
 */
export function materialRemovalRateMm3PerMin(input: { axialDepthMm: number; radialDepthMm: number; feedMmPerMin: number }): number {
  const { axialDepthMm, radialDepthMm, feedMmPerMin } = input;
  requirePositive("materialRemovalRateMm3PerMin", "axialDepthMm", axialDepthMm);
  requirePositive("materialRemovalRateMm3PerMin", "radialDepthMm", radialDepthMm);
  requirePositive("materialRemovalRateMm3PerMin", "feedMmPerMin", feedMmPerMin);
  return axialDepthMm * radialDepthMm * feedMmPerMin;
}
