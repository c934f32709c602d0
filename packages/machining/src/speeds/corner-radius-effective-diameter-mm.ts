import { requireNonNegative, requirePositive } from "../internal/require.js";

/**
 * Effective cutting diameter of a corner-radius (bull-nose) cutter at an axial depth smaller
 * than the corner radius, tool axis normal to the surface.
 *
 * D_eff = D − 2·r + 2·√(r² − (r − ap)²)   for ap < r;   D_eff = D for ap ≥ r
 *
 * With r = D/2 this is the ball-nose formula 2·√(ap·(D − ap)).
 *
 * @param input.diameterMm D, nominal cutter diameter [mm]
 * @param input.cornerRadiusMm r, corner radius [mm], 0 ≤ r ≤ D/2
 * @param input.axialDepthMm ap [mm]
 * @returns D_eff [mm]
 * @throws RangeError for D ≤ 0, ap ≤ 0, r < 0 or r > D/2
 * @source Geometry (circle of contact at the top of the cut); computed here.
 * @example cornerRadiusEffectiveDiameterMm({ diameterMm: 10, cornerRadiusMm: 1, axialDepthMm: 0.5 }) // 9.732 mm
 */
export function cornerRadiusEffectiveDiameterMm(input: { diameterMm: number; cornerRadiusMm: number; axialDepthMm: number }): number {
  const { diameterMm, cornerRadiusMm, axialDepthMm } = input;
  requirePositive("cornerRadiusEffectiveDiameterMm", "diameterMm", diameterMm);
  requireNonNegative("cornerRadiusEffectiveDiameterMm", "cornerRadiusMm", cornerRadiusMm);
  requirePositive("cornerRadiusEffectiveDiameterMm", "axialDepthMm", axialDepthMm);
  if (cornerRadiusMm > diameterMm / 2) {
    throw new RangeError("cornerRadiusEffectiveDiameterMm requires cornerRadiusMm <= diameterMm / 2");
  }
  if (axialDepthMm >= cornerRadiusMm) return diameterMm;
  const rise = cornerRadiusMm - axialDepthMm;
  return diameterMm - 2 * cornerRadiusMm + 2 * Math.sqrt(cornerRadiusMm * cornerRadiusMm - rise * rise);
}
