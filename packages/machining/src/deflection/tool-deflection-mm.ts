import { requirePositive } from "../internal/require.js";

/**
 * Tip deflection of a solid round cantilever (the cutter sticking out of its holder) under a
 * lateral load at the tip.
 *
 * δ = F · L³ / (3 · E · I),   I = π · d⁴ / 64,   E [N/mm²] = 1000 · E [GPa]
 *
 * Assumes a rigid clamp, small deflections, Euler–Bernoulli bending (L ≫ d; shear ignored).
 * For fluted sections pass an equivalent diameter (≈ 0.8 · D, Kops & Vo 1990); for a shank plus
 * fluted tip use steppedToolDeflectionMm. The load at the tip is conservative: the real resultant
 * acts ap/2 above the tip.
 *
 * @param input.forceN F, lateral force at the tip [N]
 * @param input.stickoutMm L, free length from the holder face to the tip [mm]
 * @param input.diameterMm d, (equivalent) diameter [mm]
 * @param input.youngsModulusGPa E [GPa] (cemented carbide ≈ 530–630, HSS ≈ 200–220; from memory)
 * @returns δ [mm]
 * @throws RangeError if any input is not > 0
 * @source Standard cantilever formula (Roark's Formulas for Stress and Strain; any strength-of-materials text).
 * @example toolDeflectionMm({ forceN: 50, stickoutMm: 25, diameterMm: 6, youngsModulusGPa: 600 }) // 0.0068225 mm
 */
export function toolDeflectionMm(input: { forceN: number; stickoutMm: number; diameterMm: number; youngsModulusGPa: number }): number {
  const { forceN, stickoutMm, diameterMm, youngsModulusGPa } = input;
  requirePositive("toolDeflectionMm", "forceN", forceN);
  requirePositive("toolDeflectionMm", "stickoutMm", stickoutMm);
  requirePositive("toolDeflectionMm", "diameterMm", diameterMm);
  requirePositive("toolDeflectionMm", "youngsModulusGPa", youngsModulusGPa);
  const inertiaMm4 = (Math.PI * diameterMm ** 4) / 64;
  return (forceN * stickoutMm ** 3) / (3 * youngsModulusGPa * 1000 * inertiaMm4);
}
