import type { Role } from "@ringdown/contracts";

/**
 * Runout (TIR) makes one flute take a bigger chip than the others: with a chip load of a few
 * hundredths of a millimetre, a few hundredths of runout can double one flute's load and break a
 * small cutter (0.003–0.010 in from a poor collet adapter is enough).
 *
 * Thresholds — common practice, no published source: over 0.02 mm is large for any cutter; for
 * cutters of 3.2 mm (1/8 in) and under, whose chip loads are around 0.01–0.03 mm, over 0.01 mm.
 */
export const RUNOUT_LARGE_MM = 0.02;
export const RUNOUT_LARGE_SMALL_CUTTER_MM = 0.01;
export const SMALL_CUTTER_MM = 3.2;

export function runoutIsLarge(runoutMm: number, cutterDiameterMm: number | null | undefined): boolean {
  if (!Number.isFinite(runoutMm)) return false;
  const small = cutterDiameterMm !== null && cutterDiameterMm !== undefined && cutterDiameterMm <= SMALL_CUTTER_MM;
  return runoutMm > (small ? RUNOUT_LARGE_SMALL_CUTTER_MM : RUNOUT_LARGE_MM);
}

/** Programmers, tooling managers and owners build assemblies; operators read them. */
export function canEditAssemblies(role: Role): boolean {
  return role !== "operator";
}
