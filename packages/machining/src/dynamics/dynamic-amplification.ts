import { requireInHalfOpenRange, requireNonNegative, requirePositive } from "../internal/require.js";

/**
 * Dynamic amplification of a single mode driven at a frequency: steady vibration amplitude
 * divided by the static deflection under the same force amplitude.
 *
 * DAF = 1 / √((1 − r²)² + (2ζr)²),   r = f / fn      (= 1/(2ζ) at r = 1)
 *
 * @param input.frequencyHz f, forcing frequency (e.g. tooth passing) [Hz] (≥ 0)
 * @param input.naturalFrequencyHz fn [Hz]
 * @param input.dampingRatio ζ [-], 0 < ζ < 1
 * @returns DAF [-]
 * @throws RangeError for f < 0, fn ≤ 0 or ζ outside (0, 1)
 * @source Rao, Mechanical Vibrations, harmonically excited SDOF (from memory).
 * @example dynamicAmplification({ frequencyHz: 600, naturalFrequencyHz: 580, dampingRatio: 0.03 }) // 10.6757
 */
export function dynamicAmplification(input: { frequencyHz: number; naturalFrequencyHz: number; dampingRatio: number }): number {
  const { frequencyHz, naturalFrequencyHz, dampingRatio } = input;
  requireNonNegative("dynamicAmplification", "frequencyHz", frequencyHz);
  requirePositive("dynamicAmplification", "naturalFrequencyHz", naturalFrequencyHz);
  requirePositive("dynamicAmplification", "dampingRatio", dampingRatio);
  requireInHalfOpenRange("dynamicAmplification", "dampingRatio", dampingRatio, 0, 1);
  const r = frequencyHz / naturalFrequencyHz;
  return 1 / Math.sqrt((1 - r * r) ** 2 + (2 * dampingRatio * r) ** 2);
}
