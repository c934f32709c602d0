import { requirePositive } from "../internal/require.js";

/**
 * Mean (average over the engaged arc) uncut chip thickness in peripheral milling.
 *
 * h_m = fz · (cos φst − cos φex) / (φex − φst)
 * For an arc that starts or ends at φ = 0 (always the case for a straight wall) this is
 *   h_m = fz · (2·ae/D) / φe,  φe = arccos(1 − 2·ae/D)
 * which gives 2·fz/π for a full slot.
 *
 * Assumes a circular tooth path, no runout, no helix.
 *
 * @param input.chipLoadMm fz, feed per tooth [mm]
 * @param input.diameterMm D [mm]
 * @param input.radialDepthMm ae [mm], 0 < ae ≤ D
 * @returns h_m [mm]
 * @throws RangeError for non-positive inputs or ae > D
 * @source Altintas, Manufacturing Automation, 2nd ed., ch. 2 (from memory); same mean appears in
 *   Tschätsch & Dietrich, Praxis der Zerspantechnik, 11th ed. (secondary transcription).
 * @example meanChipThicknessMm({ chipLoadMm: 0.1, diameterMm: 10, radialDepthMm: 1 }) // 0.031080 mm
 */
export function meanChipThicknessMm(input: { chipLoadMm: number; diameterMm: number; radialDepthMm: number }): number {
  const { chipLoadMm, diameterMm, radialDepthMm } = input;
  requirePositive("meanChipThicknessMm", "chipLoadMm", chipLoadMm);
  requirePositive("meanChipThicknessMm", "diameterMm", diameterMm);
  requirePositive("meanChipThicknessMm", "radialDepthMm", radialDepthMm);
  if (radialDepthMm > diameterMm) {
    throw new RangeError("meanChipThicknessMm requires radialDepthMm <= diameterMm");
  }
  const cosExit = 1 - (2 * radialDepthMm) / diameterMm;
  const phiE = Math.acos(cosExit);
  return (chipLoadMm * (1 - cosExit)) / phiE;
}
