import { requireInHalfOpenRange, requirePositive } from "../internal/require.js";
import type { Mode } from "./mode.js";
import { naturalFrequencyHz } from "./natural-frequency-hz.js";

/**
 * Builds a mode from a moving mass and the stiffness holding it (e.g. a carriage on its drive
 * belt), for estimating a low-frequency mode before it is measured.
 *
 * fn = (1/2π) · √(k/m);  ζ as given; modal stiffness = k
 *
 * @param input.massKg m [kg]
 * @param input.stiffnessNPerMm k [N/mm]
 * @param input.dampingRatio ζ [-], 0 < ζ < 1
 * @param input.direction "x" | "y"
 * @returns the mode { direction, frequencyHz, dampingRatio, stiffnessNPerMm }
 * @throws RangeError for m ≤ 0, k ≤ 0, ζ outside (0, 1) or an unknown direction
 * @source Rao, Mechanical Vibrations (single-degree-of-freedom model; from memory).
 * @example modeFromMassStiffness({ massKg: 10, stiffnessNPerMm: 78.48, dampingRatio: 0.05, direction: "x" }).frequencyHz // 14.099 Hz
 */
export function modeFromMassStiffness(input: { massKg: number; stiffnessNPerMm: number; dampingRatio: number; direction: "x" | "y" }): Mode {
  const { massKg, stiffnessNPerMm, dampingRatio, direction } = input;
  requirePositive("modeFromMassStiffness", "massKg", massKg);
  requirePositive("modeFromMassStiffness", "stiffnessNPerMm", stiffnessNPerMm);
  requirePositive("modeFromMassStiffness", "dampingRatio", dampingRatio);
  requireInHalfOpenRange("modeFromMassStiffness", "dampingRatio", dampingRatio, 0, 1);
  if (direction !== "x" && direction !== "y") {
    throw new RangeError('modeFromMassStiffness requires direction to be "x" or "y"');
  }
  return { direction, frequencyHz: naturalFrequencyHz({ stiffnessNPerMm, massKg }), dampingRatio, stiffnessNPerMm };
}
