import { requirePositive } from "../internal/require.js";

/**
 * Cutting power from the specific cutting energy and the removal rate.
 *
 * Pc = u · Q / 60       (u [J/mm³], Q [mm³/min], /60 for seconds)
 *
 * In milling the Kienzle specific force at the mean chip thickness gives u exactly
 * (Pc / Q = kc(h_m)); mind the units: u [J/mm³] = kc [N/mm²] / 1000.
 * This is power at the cutter; the spindle motor must also cover its own losses.
 *
 * @param input.specificEnergyJPerMm3 u, specific cutting energy (unit power) [J/mm³] (= kc [N/mm²] / 1000)
 * @param input.materialRemovalRateMm3PerMin Q [mm³/min]
 * @returns Pc [W]
 * @throws RangeError if either input is not > 0
 * @source Machinery's Handbook, "Machining Power" (Pc = Kp·Q, inch form; from memory);
 *   Groover, Fundamentals of Modern Manufacturing, unit-power table (secondary transcription).
 * @example cuttingPowerW({ specificEnergyJPerMm3: 0.8, materialRemovalRateMm3PerMin: 18000 }) // 240 W
 */
export function cuttingPowerW(input: { specificEnergyJPerMm3: number; materialRemovalRateMm3PerMin: number }): number {
  const { specificEnergyJPerMm3, materialRemovalRateMm3PerMin } = input;
  requirePositive("cuttingPowerW", "specificEnergyJPerMm3", specificEnergyJPerMm3);
  requirePositive("cuttingPowerW", "materialRemovalRateMm3PerMin", materialRemovalRateMm3PerMin);
  return (specificEnergyJPerMm3 * materialRemovalRateMm3PerMin) / 60;
}
