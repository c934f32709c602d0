import { requirePositive } from "../internal/require.js";

/**
 * Damping ratio from the half-power (−3 dB) bandwidth of a resonance peak.
 *
 * ζ ≈ (f2 − f1) / (2 · fp)      (Q = 1/(2ζ); f1, f2 where |G| = |G|peak/√2)
 *
 * The approximation is good for light damping (ζ < 0.1); on an exact single-mode receptance with
 * ζ = 0.05 it reads 0.0501–0.0503 depending on whether fn or the peak frequency is used.
 * fitModeFromFrf uses the exact inversion instead.
 *
 * @param input.lowerHz f1 [Hz]
 * @param input.upperHz f2 [Hz], f2 > f1
 * @param input.peakHz fp, peak (or natural) frequency [Hz]
 * @returns ζ [-]
 * @throws RangeError for non-positive frequencies or f2 ≤ f1
 * @source Rao, Mechanical Vibrations, quality factor and bandwidth (from memory); Inman, Engineering Vibration.
 * @example dampingRatioFromHalfPower({ lowerHz: 475, upperHz: 525, peakHz: 500 }) // 0.05
 */
export function dampingRatioFromHalfPower(input: { lowerHz: number; upperHz: number; peakHz: number }): number {
  const { lowerHz, upperHz, peakHz } = input;
  requirePositive("dampingRatioFromHalfPower", "lowerHz", lowerHz);
  requirePositive("dampingRatioFromHalfPower", "upperHz", upperHz);
  requirePositive("dampingRatioFromHalfPower", "peakHz", peakHz);
  if (!(upperHz > lowerHz)) throw new RangeError("dampingRatioFromHalfPower requires upperHz > lowerHz");
  return (upperHz - lowerHz) / (2 * peakHz);
}
