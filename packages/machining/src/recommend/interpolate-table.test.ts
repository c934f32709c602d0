import { describe, expect, it } from "vitest";
import { interpolateTable, preparedTable } from "./interpolate-table.js";

describe("interpolateTable / preparedTable", () => {
  const pts = [
    { x: 12, y: 0.08 },
    { x: 3, y: 0.02 },
    { x: 6, y: 0.04 },
  ];
  it("interpolates linearly between sorted points and flags held end values", () => {
    expect(interpolateTable(pts, 9).value).toBeCloseTo(0.06, 12);
    expect(interpolateTable(pts, 4.5)).toEqual({ value: 0.03, outside: false });
    expect(interpolateTable(pts, 1)).toEqual({ value: 0.02, outside: true });
    expect(interpolateTable(pts, 20)).toEqual({ value: 0.08, outside: true });
  });
  it("the prepared form gives the same values", () => {
    const f = preparedTable(pts);
    for (const x of [1, 3, 4.5, 6, 9, 12, 20]) expect(f(x)).toBeCloseTo(interpolateTable(pts, x).value, 15);
  });
});
