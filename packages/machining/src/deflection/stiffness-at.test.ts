import { describe, expect, it } from "vitest";
import { stiffnessAt } from "./stiffness-at.js";
import { stiffnessMapLookup, type StiffnessPoint } from "./stiffness-map-lookup.js";

describe("stiffnessAt / stiffnessMapLookup", () => {
  const line: StiffnessPoint[] = [
    { xMm: 0, yMm: 0, stiffnessNPerMm: 400, direction: "y" },
    { xMm: 1000, yMm: 0, stiffnessNPerMm: 100, direction: "y" },
    { xMm: 500, yMm: 0, stiffnessNPerMm: 999, direction: "x" },
  ];

  it("interpolates compliance, not stiffness: midway between 400 and 100 N/mm is 1/((1/400 + 1/100)/2) = 160 N/mm (hand calculation)", () => {
    expect(stiffnessAt({ points: line, xMm: 500, yMm: 0, direction: "y" })).toBeCloseTo(160, 9);
    expect(stiffnessMapLookup({ points: line, xMm: 500, yMm: 0, direction: "y" }).method).toBe("linear");
  });

  it("recovers a simply supported beam's compliance exactly where measured and closely between (BEAM-1 formula, Roark)", () => {
    // Gantry beam: E 69 GPa, I 1e6 mm⁴, span 1000 mm; compliance under a load at x: x²(L−x)²/(3EIL), plus a 0.002 mm/N carriage.
    const e = 69000;
    const i = 1e6;
    const l = 1000;
    const c = (x: number): number => 0.002 + (x * x * (l - x) ** 2) / (3 * e * i * l);
    expect(1 / (c(500) - 0.002)).toBeCloseTo(3312, 0); // 48EI/L³ at mid-span (BEAM-1)
    const pts: StiffnessPoint[] = [0, 250, 500, 750, 1000].map((x) => ({ xMm: x, yMm: 0, stiffnessNPerMm: 1 / c(x), direction: "y" as const }));
    expect(stiffnessAt({ points: pts, xMm: 250, yMm: 0, direction: "y" })).toBeCloseTo(1 / c(250), 9);
    const mid = stiffnessAt({ points: pts, xMm: 375, yMm: 0, direction: "y" });
    expect(Math.abs(mid * c(375) - 1)).toBeLessThan(0.02);
  });

  it("bilinear on a full grid", () => {
    const grid: StiffnessPoint[] = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 1 / 0.001, direction: "x" },
      { xMm: 100, yMm: 0, stiffnessNPerMm: 1 / 0.002, direction: "x" },
      { xMm: 0, yMm: 100, stiffnessNPerMm: 1 / 0.003, direction: "x" },
      { xMm: 100, yMm: 100, stiffnessNPerMm: 1 / 0.004, direction: "x" },
    ];
    const look = stiffnessMapLookup({ points: grid, xMm: 50, yMm: 50, direction: "x" });
    expect(look.method).toBe("bilinear");
    expect(1 / look.stiffnessNPerMm).toBeCloseTo(0.0025, 12);
    expect(1 / stiffnessAt({ points: grid, xMm: 25, yMm: 75, direction: "x" })).toBeCloseTo(0.75 * 0.25 * 0.001 + 0.25 * 0.25 * 0.002 + 0.75 * 0.75 * 0.003 + 0.25 * 0.75 * 0.004, 12);
  });

  it("inverse distance on scattered points, exact at a measured point", () => {
    const pts: StiffnessPoint[] = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 500, direction: "x" },
      { xMm: 100, yMm: 20, stiffnessNPerMm: 250, direction: "x" },
      { xMm: 40, yMm: 80, stiffnessNPerMm: 300, direction: "x" },
    ];
    expect(stiffnessMapLookup({ points: pts, xMm: 50, yMm: 40, direction: "x" }).method).toBe("inverse-distance");
    expect(stiffnessAt({ points: pts, xMm: 100, yMm: 20, direction: "x" })).toBeCloseTo(250, 12);
    const v = stiffnessAt({ points: pts, xMm: 50, yMm: 40, direction: "x" });
    expect(v).toBeGreaterThan(250);
    expect(v).toBeLessThan(500);
  });

  it("holds the edge value outside the measured area and says so", () => {
    const look = stiffnessMapLookup({ points: line, xMm: 1500, yMm: 0, direction: "y" });
    expect(look.stiffnessNPerMm).toBeCloseTo(100, 12);
    expect(look.outsideMeasuredArea).toBe(true);
    expect(stiffnessMapLookup({ points: line, xMm: 200, yMm: 0, direction: "y" }).outsideMeasuredArea).toBe(false);
  });

  it("rejects a direction with no points and a non-positive stiffness", () => {
    expect(() => stiffnessAt({ points: line, xMm: 0, yMm: 0, direction: "z" })).toThrow("stiffnessAt requires at least one point with direction z");
    expect(() => stiffnessAt({ points: [{ xMm: 0, yMm: 0, stiffnessNPerMm: 0, direction: "x" }], xMm: 0, yMm: 0, direction: "x" })).toThrow(RangeError);
  });
});
