import { requirePositive, requirePositiveInteger } from "../internal/require.js";

/**
 * Tooth-passing frequency: how often a cutting edge strikes the work.
 *
 * f_tp = z · n / 60     (spindle rotation frequency n/60; harmonics h · f_tp)
 *
 * @param input.rpm n [rpm]
 * @param input.flutes z [-]
 * @returns f_tp [Hz]
 * @throws RangeError for n ≤ 0 or z not an integer ≥ 1
 * @source Smith & Tlusty, "Update on high-speed milling dynamics", ASME J. Eng. Ind. 112(2), 1990 (abstract).
 * @example toothPassingFrequencyHz({ rpm: 18000, flutes: 2 }) // 600 Hz
 */
export function toothPassingFrequencyHz(input: { rpm: number; flutes: number }): number {
  const { rpm, flutes } = input;
  requirePositive("toothPassingFrequencyHz", "rpm", rpm);
  requirePositiveInteger("toothPassingFrequencyHz", "flutes", flutes);
  return (flutes * rpm) / 60;
}
