import { requireFinite, requirePositive } from "../internal/require.js";

/** Axis of a stiffness measurement or of a vibration mode. */
export type Axis = "x" | "y" | "z";

/** One measured stiffness at a work position (serialisable; e.g. a dial-indicator reading under a known load). */
export interface StiffnessPoint {
  /** Work position where the stiffness was measured, machine X [mm] */
  xMm: number;
  /** Work position, machine Y [mm] */
  yMm: number;
  /** Static stiffness at the tool in `direction` [N/mm] */
  stiffnessNPerMm: number;
  /** Direction of the load and of the measured deflection */
  direction: Axis;
}

/** Result of a stiffness-map lookup, with how it was obtained. */
export interface StiffnessLookup {
  /** Interpolated stiffness [N/mm] */
  stiffnessNPerMm: number;
  /** "single" (one point), "linear" (points along one line), "bilinear" (full rectangular grid) or "inverse-distance" (scattered points) */
  method: "single" | "linear" | "bilinear" | "inverse-distance";
  /** True when the position lies outside the measured rectangle: the edge value is held (not extrapolated) */
  outsideMeasuredArea: boolean;
  /** Number of points used for this direction */
  pointCount: number;
}

/**
 * Stiffness at a work position from a map of measured points, interpolated on compliance.
 *
 * Compliance c = 1/k is interpolated, not k: deflections add linearly in compliance, and the
 * compliance of a beam under a moving load is a smooth polynomial in position.
 *  - points on a full rectangular grid of X and Y values: bilinear interpolation of c;
 *    points along a single line: linear interpolation of c;
 *  - scattered points: inverse-distance weighting of c with power 2 (Shepard), exact at the points.
 * Outside the measured rectangle the value at the nearest edge is held and `outsideMeasuredArea`
 * says so (no extrapolation of a measurement beyond where it was taken).
 *
 * @param input.points measured points (any directions; only `direction` ones are used) [mm, N/mm]
 * @param input.xMm work position X [mm]
 * @param input.yMm work position Y [mm]
 * @param input.direction axis of the wanted stiffness
 * @returns the interpolated stiffness [N/mm] and how it was obtained
 * @throws RangeError when no point has that direction, or a point has k ≤ 0 or a non-finite position
 * @source Shepard, "A two-dimensional interpolation function for irregularly-spaced data", ACM 1968
 *   (inverse-distance weighting; from memory); bilinear interpolation (standard).
 */
export function stiffnessMapLookup(
  input: { points: readonly StiffnessPoint[]; xMm: number; yMm: number; direction: Axis },
  /** Name used in error messages (callers that wrap this function pass their own) */
  fn = "stiffnessMapLookup",
): StiffnessLookup {
  const { points, xMm, yMm, direction } = input;
  requireFinite(fn, "xMm", xMm);
  requireFinite(fn, "yMm", yMm);
  // Merge repeated positions by averaging their compliance.
  const merged = new Map<string, { x: number; y: number; c: number; n: number }>();
  points.forEach((p, i) => {
    if (p.direction !== direction) return;
    requireFinite(fn, `points[${i}].xMm`, p.xMm);
    requireFinite(fn, `points[${i}].yMm`, p.yMm);
    requirePositive(fn, `points[${i}].stiffnessNPerMm`, p.stiffnessNPerMm);
    const key = `${p.xMm}|${p.yMm}`;
    const m = merged.get(key);
    if (m) {
      m.c += 1 / p.stiffnessNPerMm;
      m.n += 1;
    } else merged.set(key, { x: p.xMm, y: p.yMm, c: 1 / p.stiffnessNPerMm, n: 1 });
  });
  const pts = [...merged.values()].map((m) => ({ x: m.x, y: m.y, c: m.c / m.n }));
  if (pts.length === 0) throw new RangeError(`${fn} requires at least one point with direction ${direction}`);
  const pointCount = pts.length;
  const xs = [...new Set(pts.map((p) => p.x))].sort((a, b) => a - b);
  const ys = [...new Set(pts.map((p) => p.y))].sort((a, b) => a - b);
  const xMin = xs[0]!;
  const xMax = xs[xs.length - 1]!;
  const yMin = ys[0]!;
  const yMax = ys[ys.length - 1]!;
  const outsideMeasuredArea = xMm < xMin || xMm > xMax || yMm < yMin || yMm > yMax;
  if (pointCount === 1) {
    return { stiffnessNPerMm: 1 / pts[0]!.c, method: "single", outsideMeasuredArea: xMm !== xMin || yMm !== yMin, pointCount };
  }
  if (xs.length * ys.length === pointCount) {
    // Full grid (a line is a grid with one row or one column).
    const grid = new Map(pts.map((p) => [`${p.x}|${p.y}`, p.c]));
    const at = (x: number, y: number): number => grid.get(`${x}|${y}`)!;
    const bracket = (vals: number[], v: number): [number, number, number] => {
      if (vals.length === 1 || v <= vals[0]!) return [0, 0, 0];
      if (v >= vals[vals.length - 1]!) return [vals.length - 1, vals.length - 1, 0];
      let i = 0;
      while (vals[i + 1]! < v) i++;
      return [i, i + 1, (v - vals[i]!) / (vals[i + 1]! - vals[i]!)];
    };
    const [i0, i1, tx] = bracket(xs, xMm);
    const [j0, j1, ty] = bracket(ys, yMm);
    const x0 = xs[i0]!;
    const x1 = xs[i1]!;
    const y0 = ys[j0]!;
    const y1 = ys[j1]!;
    const c = (1 - tx) * (1 - ty) * at(x0, y0) + tx * (1 - ty) * at(x1, y0) + (1 - tx) * ty * at(x0, y1) + tx * ty * at(x1, y1);
    const method = xs.length === 1 || ys.length === 1 ? "linear" : "bilinear";
    return { stiffnessNPerMm: 1 / c, method, outsideMeasuredArea, pointCount };
  }
  // Scattered points: Shepard inverse-distance weighting (power 2) on compliance, at the position
  // held inside the measured rectangle.
  const qx = Math.min(Math.max(xMm, xMin), xMax);
  const qy = Math.min(Math.max(yMm, yMin), yMax);
  let wSum = 0;
  let cSum = 0;
  for (const p of pts) {
    const d2 = (p.x - qx) ** 2 + (p.y - qy) ** 2;
    if (d2 === 0) return { stiffnessNPerMm: 1 / p.c, method: "inverse-distance", outsideMeasuredArea, pointCount };
    const w = 1 / d2;
    wSum += w;
    cSum += w * p.c;
  }
  return { stiffnessNPerMm: wSum / cSum, method: "inverse-distance", outsideMeasuredArea, pointCount };
}
