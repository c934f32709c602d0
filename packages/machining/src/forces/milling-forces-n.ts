import { millingForceCore } from "./internal/milling-force-core.js";
import { requireFinite, requireNonNegative, requirePositive, requirePositiveInteger } from "../internal/require.js";

/** Cutting forces of a straight-tooth peripheral milling cut. */
export interface MillingForces {
  /** F̄x, mean force along the feed direction over a revolution [N] */
  meanFeedForceN: number;
  /** F̄y, mean force normal to the feed over a revolution [N] */
  meanNormalForceN: number;
  /** |F̄|, magnitude of the mean force vector [N] */
  meanResultantN: number;
  /** Largest magnitude of the instantaneous total force vector over a revolution [N] */
  peakResultantN: number;
  /** Mean tangential force summed over the teeth in cut (gives the cutting torque) [N] */
  meanTangentialForceN: number;
}

/**
 * Mean and peak cutting forces of a milling cut from the linear mechanistic force model.
 *
 * Per tooth in cut: h = c·sin φ, Ft = Kt·a·h, Fr = Kr·Ft,
 *   Fx = −Ft·cos φ − Fr·sin φ,  Fy = Ft·sin φ − Fr·cos φ
 * Mean over a revolution (closed form, no edge forces):
 *   F̄x = (N·a·c/8π)·[Kt·cos 2φ − Kr'·(2φ − sin 2φ)] from φst to φex
 *   F̄y = (N·a·c/8π)·[Kt·(2φ − sin 2φ) + Kr'·cos 2φ] from φst to φex     (Kr' = Kr·Kt)
 *   mean tangential = (N·a·c·Kt/2π)·(cos φst − cos φex)
 * Peak: the sum of all teeth in cut is sampled over one tooth pitch (the pattern repeats every
 * 2π/N), plus the angles where a tooth reaches 90°, enters and exits.
 *
 * Assumes straight teeth (helix ignored: conservative for the peak, exact for the mean), no
 * runout (scale c by the runout load factor for the worst flute) and a circular tooth path.
 *
 * @param input.flutes N [-]
 * @param input.axialDepthMm a [mm]
 * @param input.chipLoadMm c, feed per tooth [mm]
 * @param input.tangentialCoefficientNPerMm2 Kt [N/mm²] (Kienzle kc at the mean chip thickness is a common choice)
 * @param input.radialForceRatio Kr = Fr/Ft [-] (≥ 0)
 * @param input.startAngleRad φst [rad]
 * @param input.exitAngleRad φex [rad], φst < φex ≤ π
 * @returns mean and peak forces [N]
 * @throws RangeError for non-positive sizes, Kr < 0, or an empty/invalid angle range
 * @source Altintas, Manufacturing Automation, 2nd ed. 2012, ch. 2 (from memory; closed form verified
 *   against numerical averaging).
 * @example slotting N=4, a=2, c=0.1, Kt=796, Kr=0.212 → meanNormalForceN 159.2 N, meanFeedForceN −33.75 N
 */
export function millingForcesN(input: {
  flutes: number;
  axialDepthMm: number;
  chipLoadMm: number;
  tangentialCoefficientNPerMm2: number;
  radialForceRatio: number;
  startAngleRad: number;
  exitAngleRad: number;
}): MillingForces {
  const fn = "millingForcesN";
  const { flutes, axialDepthMm, chipLoadMm, tangentialCoefficientNPerMm2: kt, radialForceRatio: kr, startAngleRad: st, exitAngleRad: ex } = input;
  requirePositiveInteger(fn, "flutes", flutes);
  requirePositive(fn, "axialDepthMm", axialDepthMm);
  requirePositive(fn, "chipLoadMm", chipLoadMm);
  requirePositive(fn, "tangentialCoefficientNPerMm2", kt);
  requireNonNegative(fn, "radialForceRatio", kr);
  requireFinite(fn, "startAngleRad", st);
  requireFinite(fn, "exitAngleRad", ex);
  if (!(st >= 0 && ex > st && ex <= Math.PI + 1e-12)) {
    throw new RangeError(`${fn} requires 0 <= startAngleRad < exitAngleRad <= π`);
  }
  const core = millingForceCore(flutes, axialDepthMm, chipLoadMm, kt, kr, st, ex, true);
  return {
    meanFeedForceN: core.meanFeedForceN,
    meanNormalForceN: core.meanNormalForceN,
    meanResultantN: Math.hypot(core.meanFeedForceN, core.meanNormalForceN),
    peakResultantN: core.peakResultantN,
    meanTangentialForceN: core.meanTangentialForceN,
  };
}
