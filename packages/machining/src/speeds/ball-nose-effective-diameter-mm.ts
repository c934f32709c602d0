import { requireNonNegative, requirePositive } from "../internal/require.js";

/**
 * Effective cutting diameter of a ball-nose cutter at a shallow axial depth, i.e. the
 * diameter of the circle where the ball meets the top of the cut.
 *
 * Tool axis normal to the surface (tilt β = 0):  D_eff = 2·√(ap·(D − ap))     (ap < D/2)
 * With tool tilt β:                              D_eff = D · sin(β + arccos((D − 2·ap)/D))
 * D_eff = D once the contact reaches the equator (ap ≥ D/2 with no tilt, or β + arccos(…) ≥ 90°).
 *
 * @param input.diameterMm D, ball diameter [mm]
 * @param input.axialDepthMm ap, axial depth (scallop-free depth of engagement) [mm]
 * @param input.tiltDeg β, tilt of the tool axis from the surface normal [deg], default 0
 * @returns D_eff [mm], 0 < D_eff ≤ D
 * @throws RangeError for D ≤ 0, ap ≤ 0, or β outside [0°, 90°)
 * @source Geometry; the tilted form is the one printed on cutting-tool makers' formula pages (from memory, formula only).
 * @example ballNoseEffectiveDiameterMm({ diameterMm: 10, axialDepthMm: 1 }) // 6 mm
 */
export function ballNoseEffectiveDiameterMm(input: { diameterMm: number; axialDepthMm: number; tiltDeg?: number }): number {
  const { diameterMm, axialDepthMm } = input;
  const tiltDeg = input.tiltDeg ?? 0;
  requirePositive("ballNoseEffectiveDiameterMm", "diameterMm", diameterMm);
  requirePositive("ballNoseEffectiveDiameterMm", "axialDepthMm", axialDepthMm);
  requireNonNegative("ballNoseEffectiveDiameterMm", "tiltDeg", tiltDeg);
  if (tiltDeg >= 90) throw new RangeError("ballNoseEffectiveDiameterMm requires tiltDeg < 90");
  if (tiltDeg === 0) {
    if (axialDepthMm >= diameterMm / 2) return diameterMm;
    return 2 * Math.sqrt(axialDepthMm * (diameterMm - axialDepthMm));
  }
  const contact = Math.acos(Math.max(-1, (diameterMm - 2 * axialDepthMm) / diameterMm));
  const angle = (tiltDeg * Math.PI) / 180 + contact;
  return angle >= Math.PI / 2 ? diameterMm : diameterMm * Math.sin(angle);
}
