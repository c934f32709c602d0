import { requireNonNegative, requirePositive, requirePositiveInteger } from "../internal/require.js";

/** Feed taken by each flute of a cutter that runs out. */
export interface RunoutChipLoads {
  /** Feed per tooth actually removed by each flute, flute 0 being the one that takes the largest chip [mm]. */
  perFluteMm: number[];
  /** Largest per-flute feed (the flute that carries the extra load) [mm]. */
  maxMm: number;
  /** Smallest per-flute feed (0 when a flute no longer reaches the material) [mm]. */
  minMm: number;
  /** maxMm / nominal chip load: how much the runout raises the load on the worst flute [-]. */
  loadFactor: number;
}

/**
 * Feed per tooth removed by each flute when the cutter assembly runs out.
 *
 * The cutting edges sit on radii r_j = R + e·sin(2πj/z + π/z), e = TIR/2 (an eccentric cutter in
 * the phase that gives flute 0 the largest step over its predecessor). Flute j removes what the
 * previous flutes left:
 *   h_j = max(0, min over m = 1…z of (m·fz + r_j − r_{j−m}))
 * so the largest chip is fz + TIR·sin(π/z) and the smallest fz − TIR·sin(π/z) (never below 0):
 * for two flutes fz ± TIR (at most 2·fz). The chip of each flute then thins with the engagement
 * exactly as the nominal chip does.
 *
 * Assumes parallel-axis runout (offset, no tilt) and a rigid cutter; true chip is also shaped
 * by the tooth path (trochoid), which is ignored (fz ≪ D).
 *
 * @param input.chipLoadMm fz, programmed feed per tooth [mm]
 * @param input.flutes z [-]
 * @param input.runoutTirMm total indicator reading of the cutter at the cutting edges [mm] (≥ 0)
 * @returns per-flute feeds and their extremes
 * @throws RangeError for fz ≤ 0, z not an integer ≥ 1, or TIR < 0
 * @source Runout chip model as in Schmitz & Smith, Machining Dynamics, Springer 2009 (from memory);
 *   Kline & DeVor 1983 runout model (from memory). Geometry computed here.
 * @example runoutChipLoadsMm({ chipLoadMm: 0.05, flutes: 2, runoutTirMm: 0.02 }).maxMm // 0.07 mm
 */
export function runoutChipLoadsMm(input: { chipLoadMm: number; flutes: number; runoutTirMm: number }): RunoutChipLoads {
  const { chipLoadMm, flutes, runoutTirMm } = input;
  requirePositive("runoutChipLoadsMm", "chipLoadMm", chipLoadMm);
  requirePositiveInteger("runoutChipLoadsMm", "flutes", flutes);
  requireNonNegative("runoutChipLoadsMm", "runoutTirMm", runoutTirMm);
  const e = runoutTirMm / 2;
  const radius = (j: number): number => e * Math.sin((2 * Math.PI * (((j % flutes) + flutes) % flutes) + Math.PI) / flutes);
  const perFluteMm: number[] = [];
  let maxMm = 0;
  let minMm = Infinity;
  for (let j = 0; j < flutes; j++) {
    let h = Infinity;
    for (let m = 1; m <= flutes; m++) {
      h = Math.min(h, m * chipLoadMm + radius(j) - radius(j - m));
    }
    h = Math.max(0, h);
    perFluteMm.push(h);
    if (h > maxMm) maxMm = h;
    if (h < minMm) minMm = h;
  }
  return { perFluteMm, maxMm, minMm, loadFactor: maxMm / chipLoadMm };
}
