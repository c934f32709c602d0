import { requirePositive } from "../internal/require.js";

/**
 * Undamped natural frequency of a mass on a spring.
 *
 * fn = (1/2π) · √(k/m)      (k converted from N/mm to N/m: ×1000)
 *
 * Heavy assemblies on soft springs (a spindle carriage on a drive belt, a long gantry beam) give
 * low modes (tens of Hz); adding mass lowers fn by √(m0/m1).
 *
 * @param input.stiffnessNPerMm k [N/mm]
 * @param input.massKg m [kg]
 * @returns fn [Hz]
 * @throws RangeError if either input is not > 0
 * @source Rao, Mechanical Vibrations; Inman, Engineering Vibration (standard; from memory).
 * @example naturalFrequencyHz({ stiffnessNPerMm: 200, massKg: 8 }) // 25.1646 Hz
 */
export function naturalFrequencyHz(input: { stiffnessNPerMm: number; massKg: number }): number {
  const { stiffnessNPerMm, massKg } = input;
  requirePositive("naturalFrequencyHz", "stiffnessNPerMm", stiffnessNPerMm);
  requirePositive("naturalFrequencyHz", "massKg", massKg);
  return Math.sqrt((stiffnessNPerMm * 1000) / massKg) / (2 * Math.PI);
}
