import { immersionAnglesRad, type MillingDirection } from "../forces/immersion-angles-rad.js";
import { requireInClosedRange, requireNonNegative } from "../internal/require.js";

/** Average directional (orientation) factors of the zero-order milling stability model. */
export interface DirectionalFactors {
  xx: number;
  xy: number;
  yx: number;
  yy: number;
}

/**
 * Time-averaged directional factors [α] of the Altintas–Budak zero-order approximation
 * (x = feed, y = normal to feed), evaluated between the entry and exit angles:
 *
 * αxx = ½[cos 2φ − 2Kr·φ + Kr·sin 2φ]      αxy = ½[−sin 2φ − 2φ + Kr·cos 2φ]
 * αyx = ½[−sin 2φ + 2φ + Kr·cos 2φ]       αyy = ½[−cos 2φ − 2Kr·φ − Kr·sin 2φ]   (each from φst to φex)
 *
 * These equal the integrals over the engaged arc of the instantaneous matrix
 * a_xx = −[sin 2φ + Kr(1 − cos 2φ)], a_xy = −[(1 + cos 2φ) + Kr sin 2φ], a_yx = (1 − cos 2φ) − Kr sin 2φ,
 * a_yy = sin 2φ − Kr(1 + cos 2φ) (checked numerically in the tests).
 *
 * @param input.radialImmersion ae/D [-], 0 < ae/D ≤ 1
 * @param input.radialForceRatio Kr = Kr/Kt [-] (≥ 0)
 * @param input.millingDirection "climb" (down) or "conventional" (up), default "climb"
 * @returns { xx, xy, yx, yy } [-]
 * @throws RangeError for ae/D outside (0, 1] or Kr < 0
 * @source Altintas & Budak, "Analytical prediction of stability lobes in milling", CIRP Annals 44(1), 1995;
 *   Altintas, Manufacturing Automation, 2nd ed. 2012, ch. 3 (both from memory; closed form checked numerically).
 * @example slotting, Kr = 0.212 → { xx: −0.66602, xy: −π, yx: π, yy: −0.66602 }
 */
export function directionalFactors(input: { radialImmersion: number; radialForceRatio: number; millingDirection?: MillingDirection }): DirectionalFactors {
  const { radialImmersion, radialForceRatio: kr } = input;
  const millingDirection = input.millingDirection ?? "climb";
  requireInClosedRange("directionalFactors", "radialImmersion", radialImmersion, Number.MIN_VALUE, 1);
  requireNonNegative("directionalFactors", "radialForceRatio", kr);
  const { startRad: st, exitRad: ex } = immersionAnglesRad({ radialImmersion, millingDirection });
  const ax = (p: number): number => Math.cos(2 * p) - 2 * kr * p + kr * Math.sin(2 * p);
  const axy = (p: number): number => -Math.sin(2 * p) - 2 * p + kr * Math.cos(2 * p);
  const ayx = (p: number): number => -Math.sin(2 * p) + 2 * p + kr * Math.cos(2 * p);
  const ay = (p: number): number => -Math.cos(2 * p) - 2 * kr * p - kr * Math.sin(2 * p);
  return {
    xx: 0.5 * (ax(ex) - ax(st)),
    xy: 0.5 * (axy(ex) - axy(st)),
    yx: 0.5 * (ayx(ex) - ayx(st)),
    yy: 0.5 * (ay(ex) - ay(st)),
  };
}
