import { describe, expect, it } from "vitest";
import { stabilityLimitAtRpm } from "./stability-limit-at-rpm.js";
import { benchmarkCut, zoa3Cut } from "./test-systems.fixture.js";

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe("stabilityLimitAtRpm", () => {
  it("ZOA-3: at the lobe-minimum speeds 16 808.6 / 5868.7 / 3555.0 rpm the limit is 0.124496 mm (domain-reference ZOA-3)", () => {
    for (const [rpm, k] of [
      [16808.6, 0],
      [5868.7, 1],
      [3555.0, 2],
    ] as const) {
      const l = stabilityLimitAtRpm({ ...zoa3Cut, radialImmersion: 1, rpm });
      expect(rel(l.limitingDepthMm!, 0.124496)).toBeLessThan(2e-5);
      expect(l.lobeIndex).toBe(k);
      expect(l.chatterFrequencyHz).toBeCloseTo(601.14, 1);
    }
  });
  it("ZOA-4: 20 564.3 rpm (k 0) and 6296.4 rpm (k 1) → 0.13648 mm at 605 Hz", () => {
    for (const rpm of [20564.3, 6296.4]) {
      const l = stabilityLimitAtRpm({ ...zoa3Cut, radialImmersion: 1, rpm });
      expect(rel(l.limitingDepthMm!, 0.13648)).toBeLessThan(1e-4);
      expect(l.chatterFrequencyHz).toBeCloseTo(605, 2);
    }
  });
  it("the fast grid used per recipe agrees with the fine one over a sweep of speeds, immersions and directions, lightly damped modes included", () => {
    // The lightly damped 1-DOF benchmark (ζ 0.011) hides crossings right next to the frequency where
    // Re λ changes sign; the adaptive refinement of the branches must find them on the coarse grid too.
    for (const cut of [zoa3Cut, benchmarkCut]) {
      for (const radialImmersion of [0.05, 0.2, 1]) {
        for (const millingDirection of ["climb", "conventional"] as const) {
          for (let rpm = 2000; rpm <= 24000; rpm += 433) {
            const fine = stabilityLimitAtRpm({ ...cut, radialImmersion, millingDirection, rpm });
            const fast = stabilityLimitAtRpm({ ...cut, radialImmersion, millingDirection, rpm, resolution: "fast" });
            expect(fast.limitingDepthMm === null).toBe(fine.limitingDepthMm === null);
            if (fine.limitingDepthMm !== null) expect(rel(fast.limitingDepthMm!, fine.limitingDepthMm)).toBeLessThan(1e-6);
          }
        }
      }
    }
  });
});
