import { requireNonNegative } from "../internal/require.js";
import { validateModes } from "./internal/validate-modes.js";
import type { Mode } from "./mode.js";

/** A complex receptance value [mm/N]. */
export interface Receptance {
  real: number;
  imag: number;
}

/**
 * Receptance (displacement per force, the frequency response function) of a set of modes in one
 * direction at one frequency: the sum of single-degree-of-freedom terms.
 *
 * G(f) = Σ 1 / (k (1 − r² + 2iζr)),  r = f / fn
 *
 * @param input.modes modes (all are summed; filter by direction first) [Hz, -, N/mm]
 * @param input.frequencyHz f [Hz] (≥ 0)
 * @returns { real, imag } [mm/N]
 * @throws RangeError for invalid modes or f < 0
 * @source Rao, Mechanical Vibrations; Schmitz & Smith, Machining Dynamics, 2009, ch. 2 (from memory).
 * @example one mode k = 200 N/mm: receptanceMmPerN at 0 Hz → { real: 0.005, imag: 0 }
 */
export function receptanceMmPerN(input: { modes: readonly Mode[]; frequencyHz: number }): Receptance {
  validateModes("receptanceMmPerN", input.modes);
  requireNonNegative("receptanceMmPerN", "frequencyHz", input.frequencyHz);
  let real = 0;
  let imag = 0;
  for (const m of input.modes) {
    const r = input.frequencyHz / m.frequencyHz;
    const d = 1 - r * r;
    const e = 2 * m.dampingRatio * r;
    const s = 1 / (m.stiffnessNPerMm * (d * d + e * e));
    real += d * s;
    imag -= e * s;
  }
  return { real, imag };
}
