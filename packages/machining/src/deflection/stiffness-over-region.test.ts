import { describe, expect, it } from "vitest";
import type { StiffnessPoint } from "./stiffness-map-lookup.js";
import { stiffnessOverRegion } from "./stiffness-over-region.js";

// Simply supported gantry beam with the load at x: compliance x²(L−x)²/(3EIL) (Roark, point load on a
// simply supported beam; from memory), in series with a 500 N/mm carriage (0.002 mm/N).
const L = 1000;
const beamCompliance = (x: number): number => 0.002 + (x * x * (L - x) ** 2) / (3 * 69000 * 1e6 * L);
const beamMap: StiffnessPoint[] = [0, 250, 500, 750, 1000].flatMap((x) =>
  [0, 600].map((y) => ({ xMm: x, yMm: y, stiffnessNPerMm: 1 / beamCompliance(x), direction: "y" as const })),
);

describe("stiffnessOverRegion", () => {
  it("gives the softest point of a line map over part of it: 400 and 100 N/mm at the ends give 160 N/mm at mid-length (hand calculation: 1/((1/400 + 1/100)/2))", () => {
    const points: StiffnessPoint[] = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 400, direction: "y" },
      { xMm: 1000, yMm: 0, stiffnessNPerMm: 100, direction: "y" },
    ];
    const r = stiffnessOverRegion({ points, direction: "y", region: { xMinMm: 0, xMaxMm: 500, yMinMm: 0, yMaxMm: 0 } });
    expect(r.worstNPerMm).toBeCloseTo(160, 9);
    expect(r.at).toEqual({ xMm: 500, yMm: 0 });
    expect(r.method).toBe("linear");
    expect(r.outsideMeasuredArea).toBe(false);
  });

  it("finds the gantry beam softest at mid-span when the region spans it (48EI/L³ = 3312 N/mm for E 69 GPa, I 1e6 mm⁴, L 1000 mm, in series with the carriage)", () => {
    const r = stiffnessOverRegion({ points: beamMap, direction: "y", region: { xMinMm: 300, xMaxMm: 900, yMinMm: 100, yMaxMm: 500 } });
    // 1/(0.002 + 1/3312) = 434.5 N/mm, at the measured mid-span line.
    expect(r.worstNPerMm).toBeCloseTo(1 / (0.002 + 1 / 3312), 6);
    expect(r.at.xMm).toBe(500);
    expect(r.method).toBe("bilinear");
  });

  it("near one end of the beam the worst case is the region's edge nearest mid-span, stiffer than mid-span", () => {
    const r = stiffnessOverRegion({ points: beamMap, direction: "y", region: { xMinMm: 0, xMaxMm: 200, yMinMm: 0, yMaxMm: 600 } });
    // Between the measured lines x = 0 and x = 250 compliance is interpolated linearly:
    // c(200) = 0.2·c(0) + 0.8·c(250) (hand calculation).
    expect(r.worstNPerMm).toBeCloseTo(1 / (0.2 * beamCompliance(0) + 0.8 * beamCompliance(250)), 9);
    expect(r.at.xMm).toBe(200);
    expect(r.worstNPerMm).toBeGreaterThan(1 / beamCompliance(500));
  });

  it("is exact for a bilinear cell: the lowest of a brute-force 201 × 201 sampling of the hand-written bilinear compliance", () => {
    const corners = { c00: 1 / 300, c10: 1 / 120, c01: 1 / 200, c11: 1 / 90 };
    const points: StiffnessPoint[] = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 300, direction: "x" },
      { xMm: 100, yMm: 0, stiffnessNPerMm: 120, direction: "x" },
      { xMm: 0, yMm: 100, stiffnessNPerMm: 200, direction: "x" },
      { xMm: 100, yMm: 100, stiffnessNPerMm: 90, direction: "x" },
    ];
    const region = { xMinMm: 13, xMaxMm: 71, yMinMm: 22, yMaxMm: 58 };
    let worst = Infinity;
    for (let i = 0; i <= 200; i++) {
      for (let j = 0; j <= 200; j++) {
        const tx = (region.xMinMm + ((region.xMaxMm - region.xMinMm) * i) / 200) / 100;
        const ty = (region.yMinMm + ((region.yMaxMm - region.yMinMm) * j) / 200) / 100;
        const c = (1 - tx) * (1 - ty) * corners.c00 + tx * (1 - ty) * corners.c10 + (1 - tx) * ty * corners.c01 + tx * ty * corners.c11;
        worst = Math.min(worst, 1 / c);
      }
    }
    const r = stiffnessOverRegion({ points, direction: "x", region });
    expect(r.worstNPerMm).toBeCloseTo(worst, 9);
    expect(r.at).toEqual({ xMm: 71, yMm: 58 });
  });

  it("takes a soft measured point inside the region among scattered points exactly", () => {
    const points: StiffnessPoint[] = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 800, direction: "y" },
      { xMm: 900, yMm: 50, stiffnessNPerMm: 700, direction: "y" },
      { xMm: 420, yMm: 310, stiffnessNPerMm: 150, direction: "y" },
      { xMm: 100, yMm: 700, stiffnessNPerMm: 650, direction: "y" },
    ];
    const r = stiffnessOverRegion({ points, direction: "y", region: { xMinMm: 200, xMaxMm: 600, yMinMm: 200, yMaxMm: 400 } });
    expect(r.method).toBe("inverse-distance");
    expect(r.worstNPerMm).toBeCloseTo(150, 9);
    expect(r.at).toEqual({ xMm: 420, yMm: 310 });
  });

  it("says when the region reaches beyond the measured area", () => {
    const r = stiffnessOverRegion({ points: beamMap, direction: "y", region: { xMinMm: 400, xMaxMm: 600, yMinMm: 500, yMaxMm: 800 } });
    expect(r.outsideMeasuredArea).toBe(true);
    expect(r.worstNPerMm).toBeCloseTo(1 / beamCompliance(500), 9);
  });

  it("refuses an inverted or non-finite region and a direction without points", () => {
    expect(() => stiffnessOverRegion({ points: beamMap, direction: "y", region: { xMinMm: 600, xMaxMm: 400, yMinMm: 0, yMaxMm: 10 } })).toThrow(/xMaxMm/);
    expect(() => stiffnessOverRegion({ points: beamMap, direction: "y", region: { xMinMm: 0, xMaxMm: 10, yMinMm: Number.NaN, yMaxMm: 10 } })).toThrow(RangeError);
    expect(() => stiffnessOverRegion({ points: beamMap, direction: "x", region: { xMinMm: 0, xMaxMm: 10, yMinMm: 0, yMaxMm: 10 } })).toThrow(/direction x/);
  });
});
