import { requirePositive } from "../internal/require.js";

/**
 * Angle of the arc over which a tooth is in the cut (immersion angle) for peripheral milling.
 *
 * φe = arccos(1 − 2·ae/D)      (0 < ae ≤ D; φe = π for a full slot)
 *
 * Assumes a circular tooth path (feed per tooth ≪ D) and a straight wall.
 *
 * @param input.diameterMm D, cutter diameter [mm]
 * @param input.radialDepthMm ae, radial depth of cut (stepover) [mm], 0 < ae ≤ D
 * @returns φe [rad]
 * @throws RangeError if D or ae is not > 0, or ae > D
 * @source Altintas, Manufacturing Automation, 2nd ed. 2012, ch. 2 (from memory); geometry.
 * @example engagementAngleRad({ diameterMm: 10, radialDepthMm: 1 }) // 0.643501 rad (36.87°)
 */
export function engagementAngleRad(input: { diameterMm: number; radialDepthMm: number }): number {
  const { diameterMm, radialDepthMm } = input;
  requirePositive("engagementAngleRad", "diameterMm", diameterMm);
  requirePositive("engagementAngleRad", "radialDepthMm", radialDepthMm);
  if (radialDepthMm > diameterMm) {
    throw new RangeError("engagementAngleRad requires radialDepthMm <= diameterMm");
  }
  return Math.acos(1 - (2 * radialDepthMm) / diameterMm);
}
