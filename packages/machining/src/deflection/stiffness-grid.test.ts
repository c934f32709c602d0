import { describe, expect, it } from "vitest";
import { stiffnessGrid } from "./stiffness-grid.js";
import { stiffnessAt } from "./stiffness-at.js";
import type { StiffnessPoint } from "./stiffness-map-lookup.js";

describe("stiffnessGrid", () => {
  it("samples the envelope with compliance interpolation: 400 and 100 N/mm at the ends give 160 N/mm midway (hand calculation: 1/((1/400 + 1/100)/2))", () => {
    const points: StiffnessPoint[] = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 400, direction: "y" },
      { xMm: 1000, yMm: 0, stiffnessNPerMm: 100, direction: "y" },
      { xMm: 500, yMm: 0, stiffnessNPerMm: 5, direction: "x" },
    ];
    const grid = stiffnessGrid({ points, direction: "y", widthXMm: 1000, widthYMm: 500, cellsX: 3, cellsY: 2 });
    expect(grid.xMm).toEqual([0, 500, 1000]);
    expect(grid.yMm).toEqual([0, 500]);
    for (const row of grid.stiffnessNPerMm) {
      expect(row[0]).toBeCloseTo(400, 9);
      expect(row[1]).toBeCloseTo(160, 9);
      expect(row[2]).toBeCloseTo(100, 9);
    }
    expect(grid.method).toBe("linear");
    expect(grid.pointCount).toBe(2);
    expect(grid.worstCaseNPerMm).toBeCloseTo(100, 9);
    expect(grid.minNPerMm).toBeCloseTo(100, 9);
    expect(grid.softestAt).toEqual({ xMm: 1000, yMm: 0 });
    expect(grid.measuredArea).toEqual({ xMinMm: 0, xMaxMm: 1000, yMinMm: 0, yMaxMm: 0 });
  });

  it("finds a gantry beam softest at mid-span (BEAM-1: 48EI/L³ = 3312 N/mm for E 69 GPa, I 1e6 mm⁴, L 1000 mm, in series with a 500 N/mm carriage)", () => {
    // Simply supported beam, load at x: compliance x²(L−x)²/(3EIL) (Roark, from memory), plus the carriage 0.002 mm/N.
    const c = (x: number): number => 0.002 + (x * x * (1000 - x) ** 2) / (3 * 69000 * 1e6 * 1000);
    const points: StiffnessPoint[] = [0, 250, 500, 750, 1000].flatMap((x) =>
      [0, 600].map((y) => ({ xMm: x, yMm: y, stiffnessNPerMm: 1 / c(x), direction: "y" as const })),
    );
    const grid = stiffnessGrid({ points, direction: "y", widthXMm: 1000, widthYMm: 600, cellsX: 5, cellsY: 3 });
    expect(grid.method).toBe("bilinear");
    // 1/(0.002 + 1/3312) = 434.53 N/mm
    expect(grid.worstCaseNPerMm).toBeCloseTo(1 / (0.002 + 1 / 3312), 0);
    expect(grid.softestAt.xMm).toBe(500);
    expect(grid.stiffnessNPerMm[1]![0]).toBeCloseTo(500, 6);
  });

  it("never goes below the softest measured position (property: convex weights on compliance; 200 seeded scattered layouts)", () => {
    // Park–Miller minimal standard generator, seed 12345 (for repeatable layouts).
    let s = 12345;
    const rand = () => (s = (s * 16807) % 2147483647) / 2147483647;
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + Math.floor(rand() * 7);
      const points: StiffnessPoint[] = Array.from({ length: n }, () => ({
        xMm: Math.round(rand() * 1200),
        yMm: Math.round(rand() * 800),
        stiffnessNPerMm: 50 + rand() * 2000,
        direction: "x" as const,
      }));
      const grid = stiffnessGrid({ points, direction: "x", widthXMm: 1200, widthYMm: 800, cellsX: 7, cellsY: 5 });
      for (const row of grid.stiffnessNPerMm) for (const k of row) expect(k).toBeGreaterThanOrEqual(grid.worstCaseNPerMm * (1 - 1e-12));
      expect(grid.minNPerMm).toBeGreaterThanOrEqual(grid.worstCaseNPerMm * (1 - 1e-12));
      // Each grid value is the engine's own lookup at that position.
      expect(grid.stiffnessNPerMm[2]![3]).toBeCloseTo(stiffnessAt({ points, xMm: 600, yMm: 400, direction: "x" }), 9);
    }
  });

  it("refuses a direction without points, zero widths and single-cell grids", () => {
    const points: StiffnessPoint[] = [{ xMm: 0, yMm: 0, stiffnessNPerMm: 100, direction: "x" }];
    expect(() => stiffnessGrid({ points, direction: "z", widthXMm: 1, widthYMm: 1, cellsX: 2, cellsY: 2 })).toThrow(
      "stiffnessGrid requires at least one point with direction z",
    );
    expect(() => stiffnessGrid({ points, direction: "x", widthXMm: 0, widthYMm: 1, cellsX: 2, cellsY: 2 })).toThrow("stiffnessGrid requires widthXMm > 0");
    expect(() => stiffnessGrid({ points, direction: "x", widthXMm: 1, widthYMm: 1, cellsX: 1, cellsY: 2 })).toThrow("stiffnessGrid requires cellsX >= 2");
  });
});
