import { requirePositive } from "../internal/require.js";

/** Fluted-section equivalent diameter ratio De/D ≈ 0.8 (Kops & Vo, CIRP Annals 39(1), 1990). */
export const FLUTED_DIAMETER_RATIO = 0.8;

/**
 * Tip deflection of a stepped cantilever: a shank clamped in the holder with the fluted
 * section (smaller equivalent diameter) at the free end, load at the tip.
 *
 * δ = F/(3E) · [ Lf³ / I_f + (L³ − Lf³) / I_s ]
 *   I_f = π·Df⁴/64 (fluted, Df the equivalent diameter), I_s = π·Ds⁴/64 (shank),
 *   Lf = min(fluted length, L)
 * (unit-load / moment-area integration of M·m/(E·I) over the two sections).
 *
 * Assumptions as toolDeflectionMm: rigid clamp, Euler–Bernoulli, tip load (conservative).
 *
 * @param input.forceN F [N]
 * @param input.stickoutMm L, holder face to tip [mm]
 * @param input.fluteLengthMm length of the fluted section measured from the tip [mm]
 * @param input.fluteDiameterMm Df, equivalent diameter of the fluted section [mm] (≈ 0.8·D)
 * @param input.shankDiameterMm Ds [mm]
 * @param input.youngsModulusGPa E [GPa]
 * @returns δ [mm]
 * @throws RangeError if any input is not > 0
 * @source Cantilever bending by unit-load integration (computed; checked against numerical
 *   integration); equivalent diameter: Kops & Vo, CIRP Annals 39(1), 1990 (abstract).
 * @example L=30, Lf=20, Df=4.8, Ds=6, F=100 N, E=600 GPa → 0.0336485 mm
 */
export function steppedToolDeflectionMm(input: {
  forceN: number;
  stickoutMm: number;
  fluteLengthMm: number;
  fluteDiameterMm: number;
  shankDiameterMm: number;
  youngsModulusGPa: number;
}): number {
  const fn = "steppedToolDeflectionMm";
  const { forceN, stickoutMm, fluteLengthMm, fluteDiameterMm, shankDiameterMm, youngsModulusGPa } = input;
  requirePositive(fn, "forceN", forceN);
  requirePositive(fn, "stickoutMm", stickoutMm);
  requirePositive(fn, "fluteLengthMm", fluteLengthMm);
  requirePositive(fn, "fluteDiameterMm", fluteDiameterMm);
  requirePositive(fn, "shankDiameterMm", shankDiameterMm);
  requirePositive(fn, "youngsModulusGPa", youngsModulusGPa);
  const lf = Math.min(fluteLengthMm, stickoutMm);
  const iFlute = (Math.PI * fluteDiameterMm ** 4) / 64;
  const iShank = (Math.PI * shankDiameterMm ** 4) / 64;
  const l3 = stickoutMm ** 3;
  const lf3 = lf ** 3;
  return (forceN / (3 * youngsModulusGPa * 1000)) * (lf3 / iFlute + (l3 - lf3) / iShank);
}
