import { requireFinite } from "../internal/require.js";
import { stiffnessMapLookup, type Axis, type StiffnessLookup, type StiffnessPoint } from "./stiffness-map-lookup.js";

/** A rectangle of work positions [mm]. */
export interface WorkRegion {
  xMinMm: number;
  xMaxMm: number;
  yMinMm: number;
  yMaxMm: number;
}

/** The softest stiffness of a measured map over a rectangle, and where it lies. */
export interface RegionStiffness {
  /** Lowest interpolated stiffness over the region [N/mm] */
  worstNPerMm: number;
  /** Where that lowest value lies [mm] */
  at: { xMm: number; yMm: number };
  /** Interpolation used (as stiffnessMapLookup) */
  method: StiffnessLookup["method"];
  /** True when part of the region lies outside the measured rectangle (edge values held there) */
  outsideMeasuredArea: boolean;
}

/** Samples per side of the region on top of the exact candidates (used for scattered points). */
const SAMPLES = 17;

/**
 * Worst case (lowest stiffness) of a measured map over a rectangle of work positions, with the
 * same compliance interpolation as stiffnessMapLookup.
 *
 * Candidates: the region's corners, the measured X and Y lines crossing it (their intersections
 * with each other and with the region's edges) and the measured points inside it, plus a
 * 17 × 17 grid over the region.
 *  - Grid and line maps (bilinear / linear interpolation of compliance): within one cell the
 *    interpolant is bilinear, so its extremes over any sub-rectangle lie at that sub-rectangle's
 *    corners, which are all candidates: the result is exact.
 *  - Scattered points (Shepard weighting): the extremes of the interpolant lie at measured points
 *    or on the region's boundary; the points inside are candidates and the boundary is sampled
 *    every 1/16 of each side, so the result is the worst of those samples.
 * Outside the measured rectangle the edge value is held, as in stiffnessMapLookup.
 *
 * @param input.points measured points (only those with `direction` are used) [mm, N/mm]
 * @param input.direction axis of the wanted stiffness
 * @param input.region rectangle with xMinMm ≤ xMaxMm and yMinMm ≤ yMaxMm [mm]
 * @returns the lowest stiffness over the region [N/mm], where it lies and how it was interpolated
 * @throws RangeError for a non-finite or inverted region, or when no point has that direction
 * @source Extremes of a bilinear function on a rectangle at its corners (standard); Shepard,
 *   "A two-dimensional interpolation function for irregularly-spaced data", ACM 1968 (from memory).
 * @example stiffnessOverRegion({ points: [{ xMm: 0, yMm: 0, stiffnessNPerMm: 400, direction: "y" }, { xMm: 1000, yMm: 0, stiffnessNPerMm: 100, direction: "y" }], direction: "y", region: { xMinMm: 0, xMaxMm: 500, yMinMm: 0, yMaxMm: 0 } }).worstNPerMm // 160
 */
export function stiffnessOverRegion(input: { points: readonly StiffnessPoint[]; direction: Axis; region: WorkRegion }): RegionStiffness {
  const fn = "stiffnessOverRegion";
  const { points, direction, region } = input;
  requireFinite(fn, "region.xMinMm", region.xMinMm);
  requireFinite(fn, "region.xMaxMm", region.xMaxMm);
  requireFinite(fn, "region.yMinMm", region.yMinMm);
  requireFinite(fn, "region.yMaxMm", region.yMaxMm);
  if (region.xMaxMm < region.xMinMm) throw new RangeError(`${fn} requires region.xMaxMm >= region.xMinMm`);
  if (region.yMaxMm < region.yMinMm) throw new RangeError(`${fn} requires region.yMaxMm >= region.yMinMm`);
  const own = points.filter((p) => p.direction === direction);
  if (own.length === 0) throw new RangeError(`${fn} requires at least one point with direction ${direction}`);

  const inside = (v: number, lo: number, hi: number): boolean => v > lo && v < hi;
  const xs = new Set<number>([region.xMinMm, region.xMaxMm]);
  const ys = new Set<number>([region.yMinMm, region.yMaxMm]);
  for (const p of own) {
    if (inside(p.xMm, region.xMinMm, region.xMaxMm)) xs.add(p.xMm);
    if (inside(p.yMm, region.yMinMm, region.yMaxMm)) ys.add(p.yMm);
  }
  for (let i = 0; i < SAMPLES; i++) {
    xs.add(region.xMinMm + ((region.xMaxMm - region.xMinMm) * i) / (SAMPLES - 1));
    ys.add(region.yMinMm + ((region.yMaxMm - region.yMinMm) * i) / (SAMPLES - 1));
  }
  let worst: RegionStiffness | null = null;
  let outside = false;
  for (const y of ys) {
    for (const x of xs) {
      const look = stiffnessMapLookup({ points: own, xMm: x, yMm: y, direction }, fn);
      if (look.outsideMeasuredArea) outside = true;
      if (!worst || look.stiffnessNPerMm < worst.worstNPerMm) {
        worst = { worstNPerMm: look.stiffnessNPerMm, at: { xMm: x, yMm: y }, method: look.method, outsideMeasuredArea: false };
      }
    }
  }
  return { ...worst!, outsideMeasuredArea: outside };
}
