import { stiffnessMapLookup, type Axis, type StiffnessPoint } from "./stiffness-map-lookup.js";

/**
 * Stiffness at a work position from a map of measured points (interpolated on compliance 1/k:
 * bilinear on a rectangular grid, linear along a line, inverse-distance for scattered points;
 * the edge value is held outside the measured area). See stiffnessMapLookup for the details and
 * for whether the position was outside the measured area.
 *
 * @param input.points measured points [mm, N/mm]
 * @param input.xMm work position X [mm]
 * @param input.yMm work position Y [mm]
 * @param input.direction "x" | "y" | "z"
 * @returns stiffness [N/mm]
 * @throws RangeError when no point has that direction or a point is invalid
 * @source Shepard 1968 (inverse-distance weighting; from memory); bilinear interpolation (standard).
 * @example stiffnessAt({ points: [{ xMm: 0, yMm: 0, stiffnessNPerMm: 400, direction: "y" }, { xMm: 1000, yMm: 0, stiffnessNPerMm: 100, direction: "y" }], xMm: 500, yMm: 0, direction: "y" }) // 160 N/mm
 */
export function stiffnessAt(input: { points: readonly StiffnessPoint[]; xMm: number; yMm: number; direction: Axis }): number {
  return stiffnessMapLookup(input, "stiffnessAt").stiffnessNPerMm;
}
