import type { MillingDirection } from "../forces/immersion-angles-rad.js";
import { requirePositive, requirePositiveInteger } from "../internal/require.js";
import { directionalFactors } from "./directional-factors.js";
import { cachedFrfGrid, envelopeOverSpeeds, FINE_GRID, frequencyBandHz, solveBranches } from "./internal/stability-model.js";
import { validateCut, validateModes } from "./internal/validate-modes.js";
import type { Mode } from "./mode.js";

/** One speed of a stability-lobe diagram (the lower envelope of all lobes). */
export interface StabilityLobePoint {
  /** Spindle speed [rpm] */
  rpm: number;
  /** Largest chatter-free axial depth at this speed [mm]; null when no lobe crosses this speed inside the analysed band (no chatter predicted) */
  limitingDepthMm: number | null;
  /** Chatter frequency on the boundary [Hz] (null with limitingDepthMm) */
  chatterFrequencyHz: number | null;
  /** Lobe index k of the boundary (0 = highest-speed lobe) (null with limitingDepthMm) */
  lobeIndex: number | null;
}

/**
 * Milling stability-lobe diagram by the zero-order frequency-domain method of Altintas and
 * Budak, with x (feed) and y (normal) modes: the largest chatter-free axial depth at each of
 * `speeds` spindle speeds evenly spaced from minRpm to maxRpm.
 *
 * For each chatter frequency fc on a grid (dense near each mode):
 *   λ = eig([α][Φ(fc)]) (closed-form 2×2, branches ordered by continuity),
 *   a_lim = 2π / (N · Kt · Re λ), ε = π + 2 atan(Im λ/Re λ), n_k = 60 fc / (N (k + ε/2π));
 * every lobe k is then traced in the (n, a_lim) plane and the lowest one is kept at each speed.
 *
 * Validity: the zero-order approximation is accurate when the cutting force has weak harmonics
 * (several teeth in cut, larger immersions); for few teeth at low immersion it misses the
 * flip (period-doubling) lobes and can be off by tens of percent — compare with a time-domain or
 * semi-discretization solution there. Process damping (low speeds) is not modelled: the true
 * limit at low speed is higher than predicted.
 *
 * @param input.modes [{ direction: 'x'|'y', frequencyHz, dampingRatio, stiffnessNPerMm }] (x = feed direction)
 * @param input.flutes N [-]
 * @param input.radialImmersion ae/D [-] (1 = slot)
 * @param input.specificForceNPerMm2 Kt, tangential cutting-force coefficient [N/mm²]
 * @param input.radialForceRatio Kr/Kt [-]
 * @param input.minRpm lowest speed [rpm]
 * @param input.maxRpm highest speed [rpm] (> minRpm)
 * @param input.millingDirection "climb" (default) or "conventional"
 * @param input.speeds number of speeds (default 1000)
 * @param input.maxLobes highest lobe count to trace (default: every lobe that reaches minRpm, up to 200)
 * @returns points { rpm, limitingDepthMm, chatterFrequencyHz, lobeIndex }
 * @throws RangeError for invalid modes, cut parameters or speed range
 * @source Altintas & Budak, "Analytical prediction of stability lobes in milling", CIRP Annals 44(1), 1995;
 *   Altintas, Manufacturing Automation, 2nd ed. 2012, ch. 3 (both from memory).
 */
export function stabilityLobes(input: {
  modes: readonly Mode[];
  flutes: number;
  radialImmersion: number;
  specificForceNPerMm2: number;
  radialForceRatio: number;
  minRpm: number;
  maxRpm: number;
  millingDirection?: MillingDirection;
  speeds?: number;
  maxLobes?: number;
}): StabilityLobePoint[] {
  const fn = "stabilityLobes";
  validateModes(fn, input.modes);
  validateCut(fn, input);
  requirePositive(fn, "minRpm", input.minRpm);
  requirePositive(fn, "maxRpm", input.maxRpm);
  if (!(input.maxRpm > input.minRpm)) throw new RangeError(`${fn} requires maxRpm > minRpm`);
  const speeds = input.speeds ?? 1000;
  requirePositiveInteger(fn, "speeds", speeds);
  const maxLobes = input.maxLobes ?? 200;
  requirePositiveInteger(fn, "maxLobes", maxLobes);
  const alpha = directionalFactors({
    radialImmersion: input.radialImmersion,
    radialForceRatio: input.radialForceRatio,
    millingDirection: input.millingDirection ?? "climb",
  });
  const band = frequencyBandHz(input.modes, input.flutes, input.minRpm, input.maxRpm);
  const grid = cachedFrfGrid(input.modes, band.loHz, band.hiHz, FINE_GRID);
  const branches = solveBranches(grid, alpha, input.flutes, input.specificForceNPerMm2, false);
  const env = envelopeOverSpeeds(branches, input.flutes, input.minRpm, input.maxRpm, speeds, maxLobes);
  const points: StabilityLobePoint[] = new Array(speeds);
  for (let j = 0; j < speeds; j++) {
    const d = env.limitingDepthMm[j]!;
    const ok = Number.isFinite(d);
    points[j] = {
      rpm: env.rpm[j]!,
      limitingDepthMm: ok ? d : null,
      chatterFrequencyHz: ok ? env.chatterFrequencyHz[j]! : null,
      lobeIndex: ok ? env.lobeIndex[j]! : null,
    };
  }
  return points;
}
