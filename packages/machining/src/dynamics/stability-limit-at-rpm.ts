import type { MillingDirection } from "../forces/immersion-angles-rad.js";
import { requirePositive } from "../internal/require.js";
import { directionalFactors } from "./directional-factors.js";
import { boundaryAtRpm, cachedFrfGrid, FAST_GRID, FINE_GRID, frequencyBandHz, refineHit, solveBranches } from "./internal/stability-model.js";
import { validateCut, validateModes } from "./internal/validate-modes.js";
import type { Mode } from "./mode.js";

/** The stability boundary at one spindle speed. */
export interface StabilityLimit {
  /** Largest chatter-free axial depth at this speed [mm]; null when no lobe crosses it inside the analysed band */
  limitingDepthMm: number | null;
  /** Chatter frequency expected at the boundary [Hz] */
  chatterFrequencyHz: number | null;
  /** Lobe index k (0 = highest-speed lobe) */
  lobeIndex: number | null;
}

/**
 * Zero-order (Altintas–Budak) stability limit at one spindle speed: the lowest crossing of
 * any lobe with that speed. The crossing is located on a frequency grid (g(f) = 60 f/(N n) − ε/2π
 * reaching an integer k) and then refined by bisection with exact eigenvalues.
 * Same model, assumptions and validity as stabilityLobes.
 *
 * @param input.modes modes (x = feed direction) [Hz, -, N/mm]
 * @param input.flutes N [-]
 * @param input.radialImmersion ae/D [-]
 * @param input.specificForceNPerMm2 Kt [N/mm²]
 * @param input.radialForceRatio Kr/Kt [-]
 * @param input.rpm spindle speed [rpm]
 * @param input.millingDirection default "climb"
 * @param input.resolution "fast" (coarse grid, for per-recipe checks) or "fine" (default)
 * @returns { limitingDepthMm, chatterFrequencyHz, lobeIndex }
 * @throws RangeError for invalid modes, cut parameters or speed
 * @source Altintas & Budak, CIRP Annals 44(1), 1995 (from memory).
 */
export function stabilityLimitAtRpm(input: {
  modes: readonly Mode[];
  flutes: number;
  radialImmersion: number;
  specificForceNPerMm2: number;
  radialForceRatio: number;
  rpm: number;
  millingDirection?: MillingDirection;
  resolution?: "fast" | "fine";
}): StabilityLimit {
  const fn = "stabilityLimitAtRpm";
  validateModes(fn, input.modes);
  validateCut(fn, input);
  requirePositive(fn, "rpm", input.rpm);
  const alpha = directionalFactors({
    radialImmersion: input.radialImmersion,
    radialForceRatio: input.radialForceRatio,
    millingDirection: input.millingDirection ?? "climb",
  });
  const band = frequencyBandHz(input.modes, input.flutes, input.rpm, input.rpm);
  const grid = cachedFrfGrid(input.modes, band.loHz, band.hiHz, input.resolution === "fast" ? FAST_GRID : FINE_GRID);
  const branches = solveBranches(grid, alpha, input.flutes, input.specificForceNPerMm2, false);
  const hit = boundaryAtRpm(branches, input.flutes, input.rpm);
  if (!hit) return { limitingDepthMm: null, chatterFrequencyHz: null, lobeIndex: null };
  const refined = refineHit(hit, branches, input.modes, alpha, input.flutes, input.specificForceNPerMm2, input.rpm, false);
  return { limitingDepthMm: refined.limitingDepthMm, chatterFrequencyHz: refined.chatterFrequencyHz, lobeIndex: refined.lobeIndex };
}
