import { requirePositive } from "../internal/require.js";

/**
 * Damping ratio from the logarithmic decrement of a free decay (ring-down).
 *
 * δ = (1/n) · ln(x0 / xn),   ζ = δ / √(4π² + δ²)    (exact for viscous damping; ≈ δ/2π when small)
 *
 * @param input.firstAmplitude x0, amplitude of a peak [any unit]
 * @param input.laterAmplitude xn, amplitude n cycles later [same unit], 0 < xn < x0
 * @param input.cycles n, number of cycles between the two peaks [-] (> 0)
 * @returns ζ [-]
 * @throws RangeError for non-positive amplitudes or cycles, or xn ≥ x0 (no decay)
 * @source Rao, Mechanical Vibrations, logarithmic decrement (from memory); Inman, Engineering Vibration.
 * @example dampingRatioFromLogDecrement({ firstAmplitude: 1, laterAmplitude: 0.5, cycles: 5 }) // 0.0220582
 */
export function dampingRatioFromLogDecrement(input: { firstAmplitude: number; laterAmplitude: number; cycles: number }): number {
  const { firstAmplitude, laterAmplitude, cycles } = input;
  requirePositive("dampingRatioFromLogDecrement", "firstAmplitude", firstAmplitude);
  requirePositive("dampingRatioFromLogDecrement", "laterAmplitude", laterAmplitude);
  requirePositive("dampingRatioFromLogDecrement", "cycles", cycles);
  if (!(laterAmplitude < firstAmplitude)) {
    throw new RangeError("dampingRatioFromLogDecrement requires laterAmplitude < firstAmplitude");
  }
  const delta = Math.log(firstAmplitude / laterAmplitude) / cycles;
  return delta / Math.sqrt(4 * Math.PI * Math.PI + delta * delta);
}
