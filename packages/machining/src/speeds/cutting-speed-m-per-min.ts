import { requirePositive } from "../internal/require.js";

/**
 * Cutting (surface) speed at the rim of a cutter turning at a spindle speed.
 *
 * vc = π · D · n / 1000
 *
 * @param input.rpm n, spindle speed [rpm]
 * @param input.diameterMm D, cutting diameter [mm]
 * @returns vc [m/min]
 * @throws RangeError if either input is not a finite number > 0
 * @source Machinery's Handbook cutting-speed formulas (from memory); SME "Useful formulas for machining".
 * @example cuttingSpeedMPerMin({ rpm: 18000, diameterMm: 6.35 }) // 359.08 m/min
 */
export function cuttingSpeedMPerMin(input: { rpm: number; diameterMm: number }): number {
  const { rpm, diameterMm } = input;
  requirePositive("cuttingSpeedMPerMin", "rpm", rpm);
  requirePositive("cuttingSpeedMPerMin", "diameterMm", diameterMm);
  return (Math.PI * diameterMm * rpm) / 1000;
}
