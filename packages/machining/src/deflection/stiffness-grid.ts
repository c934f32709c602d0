import { requireFinite, requirePositiveInteger } from "../internal/require.js";
import { stiffnessMapLookup, type Axis, type StiffnessLookup, type StiffnessPoint } from "./stiffness-map-lookup.js";

/** A stiffness map sampled on a rectangular grid of work positions. */
export interface StiffnessGrid {
  /** Grid positions along X [mm] */
  xMm: number[];
  /** Grid positions along Y [mm] */
  yMm: number[];
  /** stiffnessNPerMm[j][i] at (xMm[i], yMm[j]) [N/mm] */
  stiffnessNPerMm: number[][];
  /** Lowest grid value [N/mm] */
  minNPerMm: number;
  /** Highest grid value [N/mm] */
  maxNPerMm: number;
  /** Where the lowest grid value lies [mm] */
  softestAt: { xMm: number; yMm: number };
  /** Interpolation used (the same for every cell) */
  method: StiffnessLookup["method"];
  /** Distinct measured positions in this direction [-] */
  pointCount: number;
  /** Bounding rectangle of the measured positions [mm]; outside it the edge value is held */
  measuredArea: { xMinMm: number; xMaxMm: number; yMinMm: number; yMaxMm: number };
  /** Lowest stiffness at any measured position [N/mm]: the worst case over the whole map, since
   *  interpolating compliance never goes beyond the measured compliances */
  worstCaseNPerMm: number;
}

/**
 * Samples a measured stiffness map on an nx × ny grid spanning [0, widthXMm] × [0, widthYMm]
 * (the machine's work envelope), with the same compliance interpolation as stiffnessMapLookup.
 *
 * Each grid value is stiffnessMapLookup at (xMm[i], yMm[j]), xMm[i] = i·widthXMm/(nx − 1).
 * Bilinear, linear and Shepard inverse-distance interpolation of compliance c = 1/k are all convex
 * combinations of the measured compliances (and the edge value is held outside the measured
 * rectangle), so no grid value is softer than the softest measured position: the worst case over
 * the envelope is min(k) over the measured positions (repeated positions averaged on compliance).
 *
 * @param input.points measured points (only those with `direction` are used) [mm, N/mm]
 * @param input.direction axis of the wanted stiffness
 * @param input.widthXMm envelope width along X, > 0 [mm]
 * @param input.widthYMm envelope width along Y, > 0 [mm]
 * @param input.cellsX grid positions along X, integer ≥ 2 [-]
 * @param input.cellsY grid positions along Y, integer ≥ 2 [-]
 * @returns the grid, its extremes, the method and the worst case [N/mm]
 * @throws RangeError when no point has that direction, for a non-positive width, or fewer than 2 cells
 * @source Convexity of bilinear and Shepard weights: Shepard, ACM 1968 (from memory); bilinear
 *   interpolation (standard).
 * @example stiffnessGrid({ points: [{ xMm: 0, yMm: 0, stiffnessNPerMm: 400, direction: "y" }, { xMm: 1000, yMm: 0, stiffnessNPerMm: 100, direction: "y" }], direction: "y", widthXMm: 1000, widthYMm: 500, cellsX: 3, cellsY: 2 }).stiffnessNPerMm[0] // [400, 160, 100]
 */
export function stiffnessGrid(input: {
  points: readonly StiffnessPoint[];
  direction: Axis;
  widthXMm: number;
  widthYMm: number;
  cellsX: number;
  cellsY: number;
}): StiffnessGrid {
  const fn = "stiffnessGrid";
  const { points, direction, widthXMm, widthYMm, cellsX, cellsY } = input;
  requireFinite(fn, "widthXMm", widthXMm);
  requireFinite(fn, "widthYMm", widthYMm);
  if (!(widthXMm > 0)) throw new RangeError(`${fn} requires widthXMm > 0`);
  if (!(widthYMm > 0)) throw new RangeError(`${fn} requires widthYMm > 0`);
  requirePositiveInteger(fn, "cellsX", cellsX);
  requirePositiveInteger(fn, "cellsY", cellsY);
  if (cellsX < 2) throw new RangeError(`${fn} requires cellsX >= 2`);
  if (cellsY < 2) throw new RangeError(`${fn} requires cellsY >= 2`);
  const own = points.filter((p) => p.direction === direction);
  if (own.length === 0) throw new RangeError(`${fn} requires at least one point with direction ${direction}`);

  const xMm = Array.from({ length: cellsX }, (_, i) => (i * widthXMm) / (cellsX - 1));
  const yMm = Array.from({ length: cellsY }, (_, j) => (j * widthYMm) / (cellsY - 1));
  let min = Infinity;
  let max = -Infinity;
  let softestAt = { xMm: 0, yMm: 0 };
  let method: StiffnessLookup["method"] = "single";
  let pointCount = 0;
  const stiffness = yMm.map((y) =>
    xMm.map((x) => {
      const look = stiffnessMapLookup({ points: own, xMm: x, yMm: y, direction });
      method = look.method;
      pointCount = look.pointCount;
      const k = look.stiffnessNPerMm;
      if (k < min) {
        min = k;
        softestAt = { xMm: x, yMm: y };
      }
      if (k > max) max = k;
      return k;
    }),
  );
  let worst = Infinity;
  for (const p of own) worst = Math.min(worst, stiffnessMapLookup({ points: own, xMm: p.xMm, yMm: p.yMm, direction }).stiffnessNPerMm);
  return {
    xMm,
    yMm,
    stiffnessNPerMm: stiffness,
    minNPerMm: min,
    maxNPerMm: max,
    softestAt,
    method,
    pointCount,
    measuredArea: {
      xMinMm: Math.min(...own.map((p) => p.xMm)),
      xMaxMm: Math.max(...own.map((p) => p.xMm)),
      yMinMm: Math.min(...own.map((p) => p.yMm)),
      yMaxMm: Math.max(...own.map((p) => p.yMm)),
    },
    worstCaseNPerMm: worst,
  };
}
