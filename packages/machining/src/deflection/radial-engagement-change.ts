import { requireNonNegative, requirePositive } from "../internal/require.js";

/**
 * Relative change of the radial engagement caused by a lateral deflection of the cutter.
 *
 * Δae / ae = δ / ae
 *
 * Simple geometric model: a deflection δ normal to the wall moves the cutting edge by δ, which
 * adds to (or removes from) the radial depth whatever the axial depth is. Because removal rate is
 * ap·ae·vf, a deep narrow cut (large ap, small ae) and a shallow wide cut at the same removal
 * rate see the same δ very differently: δ = 0.1 mm is +100 % at ae = 0.1 mm but +20 % at
 * ae = 0.5 mm. This is why light machines cut better shallow and wide.
 *
 * @param input.deflectionMm δ, lateral deflection of the cutting edge [mm] (≥ 0)
 * @param input.radialDepthMm ae [mm]
 * @returns Δae/ae [-] (multiply by 100 for %)
 * @throws RangeError for δ < 0 or ae ≤ 0
 * @source Geometry (computed here); used by Ringdown to explain its depth advice.
 * @example radialEngagementChange({ deflectionMm: 0.1, radialDepthMm: 0.5 }) // 0.2
 */
export function radialEngagementChange(input: { deflectionMm: number; radialDepthMm: number }): number {
  const { deflectionMm, radialDepthMm } = input;
  requireNonNegative("radialEngagementChange", "deflectionMm", deflectionMm);
  requirePositive("radialEngagementChange", "radialDepthMm", radialDepthMm);
  return deflectionMm / radialDepthMm;
}
