import type { MillingDirection } from "../forces/immersion-angles-rad.js";
import { requirePositive, requirePositiveInteger } from "../internal/require.js";
import { directionalFactors } from "./directional-factors.js";
import { eigenvaluesAt } from "./internal/stability-model.js";
import { validateCut, validateModes } from "./internal/validate-modes.js";
import type { Mode } from "./mode.js";

/** One point of the stability boundary, as a function of the chatter frequency. */
export interface BoundaryAtFrequency {
  /** a_lim [mm] */
  limitingDepthMm: number;
  /** ε, phase between inner and outer modulation [rad], 0 < ε < 2π */
  phaseRad: number;
  /** Spindle speeds n_k = 60 fc / (N (k + ε/2π)) for k = 0 … lobes−1 [rpm] */
  spindleSpeedsRpm: number[];
}

/**
 * Zero-order (Altintas–Budak) stability boundary at one chatter frequency: the limiting depth
 * and the spindle speeds of each lobe that chatter at that frequency.
 *
 * [Φ] = diag(Σ G_x, Σ G_y), G = 1/(k(1 − r² + 2iζr));  λ = eig([α][Φ]) (closed-form 2×2)
 * a_lim = 2π / (N · Kt · Re λ)   (≡ −(2π Λ_R/(N Kt))(1 + κ²) with Λ = −1/λ, κ = Λ_I/Λ_R)
 * ε = π + 2·atan(Im λ / Re λ),   n_k = 60 · fc / (N · (k + ε/2π))
 * Only eigenvalues with Re λ > 0 give a positive depth; both are returned when both do, shallowest first.
 *
 * @param input.modes modes in the feed (x) / normal (y) frame [Hz, -, N/mm]
 * @param input.flutes N [-]
 * @param input.radialImmersion ae/D [-]
 * @param input.specificForceNPerMm2 Kt, tangential cutting-force coefficient [N/mm²]
 * @param input.radialForceRatio Kr/Kt [-]
 * @param input.millingDirection default "climb"
 * @param input.chatterFrequencyHz fc [Hz]
 * @param input.lobes how many lobe speeds to list (default 3)
 * @returns boundary points (empty when no eigenvalue has Re λ > 0: no chatter at that frequency)
 * @throws RangeError for invalid modes or cut parameters
 * @source Altintas & Budak, CIRP Annals 44(1), 1995; Altintas, Manufacturing Automation, 2nd ed. 2012,
 *   ch. 3 (both from memory); eigenvalue form as in Schmitz & Smith, Machining Dynamics, 2009 (from memory).
 */
export function limitingDepthAtChatterFrequency(input: {
  modes: readonly Mode[];
  flutes: number;
  radialImmersion: number;
  specificForceNPerMm2: number;
  radialForceRatio: number;
  millingDirection?: MillingDirection;
  chatterFrequencyHz: number;
  lobes?: number;
}): BoundaryAtFrequency[] {
  const fn = "limitingDepthAtChatterFrequency";
  validateModes(fn, input.modes);
  validateCut(fn, input);
  requirePositive(fn, "chatterFrequencyHz", input.chatterFrequencyHz);
  const lobes = input.lobes ?? 3;
  requirePositiveInteger(fn, "lobes", lobes);
  const alpha = directionalFactors({
    radialImmersion: input.radialImmersion,
    radialForceRatio: input.radialForceRatio,
    millingDirection: input.millingDirection ?? "climb",
  });
  const ev = new Float64Array(4);
  eigenvaluesAt(input.modes, alpha, input.chatterFrequencyHz, false, ev);
  const out: BoundaryAtFrequency[] = [];
  for (const [lr, li] of [
    [ev[0]!, ev[1]!],
    [ev[2]!, ev[3]!],
  ] as const) {
    if (!(lr > 0)) continue;
    const phaseRad = Math.PI + 2 * Math.atan(li / lr);
    const spindleSpeedsRpm: number[] = [];
    for (let k = 0; k < lobes; k++) {
      spindleSpeedsRpm.push((60 * input.chatterFrequencyHz) / (input.flutes * (k + phaseRad / (2 * Math.PI))));
    }
    out.push({ limitingDepthMm: (2 * Math.PI) / (input.flutes * input.specificForceNPerMm2 * lr), phaseRad, spindleSpeedsRpm });
  }
  return out.sort((p, q) => p.limitingDepthMm - q.limitingDepthMm);
}
