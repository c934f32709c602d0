import { requireInClosedRange } from "../internal/require.js";

/** Milling direction: climb (down-milling) or conventional (up-milling). */
export type MillingDirection = "climb" | "conventional";

/** Start and exit angles of the engaged arc. */
export interface ImmersionAngles {
  /** φst [rad] */
  startRad: number;
  /** φex [rad] */
  exitRad: number;
}

/**
 * Start and exit angles of a tooth's engagement for a given radial immersion, in the
 * Altintas convention (x = feed direction, y = normal to the feed, φ measured clockwise from +y,
 * cutter turning clockwise seen from the spindle).
 *
 * Conventional (up-milling): φst = 0,                  φex = arccos(1 − 2·ae/D)
 * Climb (down-milling):      φst = arccos(2·ae/D − 1), φex = π
 * A full slot (ae/D = 1) is 0 → π in both cases.
 *
 * @param input.radialImmersion ae/D [-], 0 < ae/D ≤ 1
 * @param input.millingDirection "climb" or "conventional"
 * @returns { startRad, exitRad } [rad]
 * @throws RangeError if ae/D is outside (0, 1]
 * @source Altintas, Manufacturing Automation, 2nd ed. 2012, ch. 2–3 (from memory).
 * @example immersionAnglesRad({ radialImmersion: 0.5, millingDirection: "climb" }) // { startRad: π/2, exitRad: π }
 */
export function immersionAnglesRad(input: { radialImmersion: number; millingDirection: MillingDirection }): ImmersionAngles {
  const { radialImmersion, millingDirection } = input;
  requireInClosedRange("immersionAnglesRad", "radialImmersion", radialImmersion, Number.MIN_VALUE, 1);
  if (millingDirection === "conventional") {
    return { startRad: 0, exitRad: Math.acos(1 - 2 * radialImmersion) };
  }
  if (millingDirection === "climb") {
    return { startRad: Math.acos(2 * radialImmersion - 1), exitRad: Math.PI };
  }
  throw new RangeError('immersionAnglesRad requires millingDirection to be "climb" or "conventional"');
}
