import { requirePositive } from "../internal/require.js";

/**
 * Speed ceiling for large router bits by diameter (rim-speed rule).
 *
 * Up to 25.4 mm (1 in) the rule sets no ceiling (returns null: the spindle's and the cutter maker's
 * limits apply). Above: 18 000 rpm to 50.8 mm (2 in), 16 000 rpm to 63.5 mm (2.5 in), 12 000 rpm to
 * 88.9 mm (3.5 in); beyond, the rim speed of a 88.9 mm bit at 12 000 rpm (≈ 55.9 m/s) is held:
 *   n = 1000 · 60 · v_rim / (π · D)
 *
 * @param input.diameterMm cutter diameter D [mm]
 * @returns the ceiling [rpm], or null when the rule sets none (D ≤ 25.4 mm)
 * @throws RangeError for D ≤ 0
 * @source Common practice, no published source: the router-bit speed table widely repeated in
 *   woodworking references (values from memory). The cutter maker's marked maximum always takes precedence.
 * @example rimSpeedMaxRpm({ diameterMm: 60 }) // 16000
 */
export function rimSpeedMaxRpm(input: { diameterMm: number }): number | null {
  const { diameterMm } = input;
  requirePositive("rimSpeedMaxRpm", "diameterMm", diameterMm);
  if (diameterMm <= 25.4) return null;
  if (diameterMm <= 50.8) return 18000;
  if (diameterMm <= 63.5) return 16000;
  if (diameterMm <= 88.9) return 12000;
  const rimMPerS = (Math.PI * 88.9 * 12000) / 60000;
  return (60000 * rimMPerS) / (Math.PI * diameterMm);
}
