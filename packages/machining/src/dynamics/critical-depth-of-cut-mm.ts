import { requireInHalfOpenRange, requirePositive } from "../internal/require.js";

/**
 * Limiting depth of cut below which no spindle speed chatters, for one mode (the minimum of
 * the stability boundary, Tlusty's "b_lim,crit").
 *
 * b_lim = −1 / (2 · Ks · Re[G]min),  Re[G]min = −1 / (4kζ(1 + ζ))  at r = √(1 + 2ζ)
 *   ⇒ b_lim,crit = 2 · k · ζ · (1 + ζ) / Ks
 *
 * Assumes a single mode in the chip-thickness direction (oriented stiffness) and the regenerative
 * model with full overlap; milling directional factors are not included (use stabilityLobes).
 *
 * @param input.stiffnessNPerMm k, modal stiffness in the chip-thickness direction [N/mm]
 * @param input.dampingRatio ζ [-], 0 < ζ < 1
 * @param input.specificForceNPerMm2 Ks, cutting-force coefficient [N/mm²]
 * @returns b_lim,crit [mm]
 * @throws RangeError for k ≤ 0, Ks ≤ 0 or ζ outside (0, 1)
 * @source Tlusty, Manufacturing Processes and Equipment, Prentice Hall 2000 (from memory; derivation
 *   checked here); Schmitz & Smith, Machining Dynamics, Springer 2009, ch. 3 (from memory).
 * @example criticalDepthOfCutMm({ stiffnessNPerMm: 226000, dampingRatio: 0.012, specificForceNPerMm2: 1000 }) // 5.48909 mm
 */
export function criticalDepthOfCutMm(input: { stiffnessNPerMm: number; dampingRatio: number; specificForceNPerMm2: number }): number {
  const { stiffnessNPerMm, dampingRatio, specificForceNPerMm2 } = input;
  requirePositive("criticalDepthOfCutMm", "stiffnessNPerMm", stiffnessNPerMm);
  requirePositive("criticalDepthOfCutMm", "dampingRatio", dampingRatio);
  requireInHalfOpenRange("criticalDepthOfCutMm", "dampingRatio", dampingRatio, 0, 1);
  requirePositive("criticalDepthOfCutMm", "specificForceNPerMm2", specificForceNPerMm2);
  return (2 * stiffnessNPerMm * dampingRatio * (1 + dampingRatio)) / specificForceNPerMm2;
}
