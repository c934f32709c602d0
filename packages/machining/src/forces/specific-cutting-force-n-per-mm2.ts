import { requireInHalfOpenRange, requirePositive } from "../internal/require.js";

/**
 * Specific cutting force by Kienzle's law.
 *
 * kc = kc1.1 · h^(−mc)      (h in mm; kc1.1 is kc at h = 1 mm and b = 1 mm)
 * The cutting force on a chip of width b is then Fc = b · h · kc = b · kc1.1 · h^(1 − mc).
 *
 * Valid for chip thicknesses roughly 0.01–1 mm with a sharp tool; thin chips below the edge
 * hone rub rather than cut and the law over-predicts the cutting share of the force there.
 *
 * @param input.kc11NPerMm2 kc1.1, unit specific cutting force [N/mm²]
 * @param input.mc mc, Kienzle exponent [-], 0 ≤ mc < 1
 * @param input.chipThicknessMm h, uncut chip thickness [mm] (use the mean thickness h_m in milling)
 * @returns kc [N/mm²] (kc / 1000 is the specific cutting energy in J/mm³ at that chip thickness)
 * @throws RangeError for kc1.1 ≤ 0, h ≤ 0, or mc outside [0, 1)
 * @source Kienzle & Victor 1957 via König/Klocke, Fertigungsverfahren 1 (from memory);
 *   Tschätsch & Dietrich, Praxis der Zerspantechnik, 11th ed. 2014 (secondary transcription).
 * @example specificCuttingForceNPerMm2({ kc11NPerMm2: 1780, mc: 0.17, chipThicknessMm: 0.2 }) // 2340.16 N/mm²
 */
export function specificCuttingForceNPerMm2(input: { kc11NPerMm2: number; mc: number; chipThicknessMm: number }): number {
  const { kc11NPerMm2, mc, chipThicknessMm } = input;
  requirePositive("specificCuttingForceNPerMm2", "kc11NPerMm2", kc11NPerMm2);
  requireInHalfOpenRange("specificCuttingForceNPerMm2", "mc", mc, 0, 1);
  requirePositive("specificCuttingForceNPerMm2", "chipThicknessMm", chipThicknessMm);
  return kc11NPerMm2 * Math.pow(chipThicknessMm, -mc);
}
