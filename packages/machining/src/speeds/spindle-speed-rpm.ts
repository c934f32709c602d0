import { requirePositive } from "../internal/require.js";

/**
 * Spindle speed that gives a cutting (surface) speed at a diameter.
 *
 * n = 1000 · vc / (π · D)
 *
 * @param input.cuttingSpeedMPerMin vc, cutting speed at the cutter's rim [m/min]
 * @param input.diameterMm D, cutting diameter (use the effective diameter for ball and bull-nose cutters) [mm]
 * @returns n [rpm]
 * @throws RangeError if either input is not a finite number > 0
 * @source Machinery's Handbook, cutting-speed formulas (any recent edition; from memory);
 *   SME "Useful formulas for machining" (N = 12V/(πD), inch form).
 * @example spindleSpeedRpm({ cuttingSpeedMPerMin: 300, diameterMm: 6 }) // 15915.49 rpm
 */
export function spindleSpeedRpm(input: { cuttingSpeedMPerMin: number; diameterMm: number }): number {
  const { cuttingSpeedMPerMin, diameterMm } = input;
  requirePositive("spindleSpeedRpm", "cuttingSpeedMPerMin", cuttingSpeedMPerMin);
  requirePositive("spindleSpeedRpm", "diameterMm", diameterMm);
  // 1000 converts m to mm so that vc [m/min] / (π D [mm]) comes out in rev/min.
  return (1000 * cuttingSpeedMPerMin) / (Math.PI * diameterMm);
}
