import { requirePositive, requirePositiveInteger } from "../internal/require.js";

/**
 * Spindle speeds that put the tooth-passing frequency at the chatter frequency divided by
 * 1, 2, 3 … — the right-hand edges of the stability lobes, where the waves left by successive
 * teeth are in phase.
 *
 * n_j = 60 · fc / (z · j),   j = 1 … count      (highest first)
 *
 * @param input.chatterFrequencyHz fc, measured chatter frequency [Hz]
 * @param input.flutes z [-]
 * @param input.count how many speeds to return (j = 1 … count) [-]
 * @returns speeds [rpm], descending
 * @throws RangeError for fc ≤ 0, or z / count not integers ≥ 1
 * @source Smith & Tlusty 1990 (ASME J. Eng. Ind. 112(2), abstract); Smith & Tlusty, "Stabilizing chatter
 *   by automatic spindle speed regulation", CIRP Annals 41(1), 1992 (from memory).
 * @example stableSpindleSpeedsRpm({ chatterFrequencyHz: 1250, flutes: 3, count: 3 }) // [25000, 12500, 8333.33]
 */
export function stableSpindleSpeedsRpm(input: { chatterFrequencyHz: number; flutes: number; count: number }): number[] {
  const { chatterFrequencyHz, flutes, count } = input;
  requirePositive("stableSpindleSpeedsRpm", "chatterFrequencyHz", chatterFrequencyHz);
  requirePositiveInteger("stableSpindleSpeedsRpm", "flutes", flutes);
  requirePositiveInteger("stableSpindleSpeedsRpm", "count", count);
  const speeds: number[] = [];
  for (let j = 1; j <= count; j++) speeds.push((60 * chatterFrequencyHz) / (flutes * j));
  return speeds;
}
