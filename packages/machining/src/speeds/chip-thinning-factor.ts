import { requirePositive } from "../internal/require.js";

/**
 * Radial chip-thinning factor: how much the feed per tooth must be raised so that the
 * maximum chip thickness equals the target chip load when the stepover is less than half
 * the diameter.
 *
 * h_max = fz · sin φe with φe = arccos(1 − 2·ae/D), so for ae < D/2
 *   factor = 1 / sin φe = 1 / (2·√(ae/D − (ae/D)²))
 * and factor = 1 for ae ≥ D/2 (the tooth passes through φ = 90°, where h = fz).
 *
 * Assumes a circular tooth path and no runout; helix and nose radius ignored.
 *
 * @param input.diameterMm D, cutter diameter [mm]
 * @param input.radialDepthMm ae, radial depth of cut [mm], 0 < ae ≤ D
 * @returns factor ≥ 1 [-]
 * @throws RangeError if D or ae is not > 0, or ae > D
 * @source Geometry of peripheral milling; Altintas, Manufacturing Automation, 2nd ed., ch. 2 (from memory).
 * @example chipThinningFactor({ diameterMm: 10, radialDepthMm: 1 }) // 1.666667
 */
export function chipThinningFactor(input: { diameterMm: number; radialDepthMm: number }): number {
  const { diameterMm, radialDepthMm } = input;
  requirePositive("chipThinningFactor", "diameterMm", diameterMm);
  requirePositive("chipThinningFactor", "radialDepthMm", radialDepthMm);
  if (radialDepthMm > diameterMm) {
    throw new RangeError("chipThinningFactor requires radialDepthMm <= diameterMm");
  }
  const ratio = radialDepthMm / diameterMm;
  if (ratio >= 0.5) return 1;
  return 1 / (2 * Math.sqrt(ratio - ratio * ratio));
}
