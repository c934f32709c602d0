import { describe, expect, it } from "vitest";
import { benchmarkCut } from "./test-systems.fixture.js";
import { criticalDepthOfCutMm } from "./critical-depth-of-cut-mm.js";
import { stabilityLobes } from "./stability-lobes.js";

describe("criticalDepthOfCutMm", () => {
  it("STB-1: k 2.26e8 N/m, ζ 0.012, Ks 1000 N/mm² → 5.48909 mm (domain-reference STB-1; Tlusty, from memory; UBC-lab parameter set, FOUND-2nd)", () => {
    expect(criticalDepthOfCutMm({ stiffnessNPerMm: 226000, dampingRatio: 0.012, specificForceNPerMm2: 1000 })).toBeCloseTo(5.48909, 5);
  });
  it("STB-1 oriented at 30°: stiffness k/cos²30° → 7.31878 mm (domain-reference STB-1)", () => {
    expect(criticalDepthOfCutMm({ stiffnessNPerMm: 226000 / Math.cos(Math.PI / 6) ** 2, dampingRatio: 0.012, specificForceNPerMm2: 1000 })).toBeCloseTo(7.31878, 5);
  });
  it("STB-2: k 2e7 N/m, ζ 0.05, Ks 2000 N/mm² → 1.0500 mm (domain-reference STB-2)", () => {
    expect(criticalDepthOfCutMm({ stiffnessNPerMm: 20000, dampingRatio: 0.05, specificForceNPerMm2: 2000 })).toBeCloseTo(1.05, 9);
  });
  it("equals the minimum of the ZOA lobes for 1-DOF slotting with Ks = N·Kn/4 (ZOA-6: 0.298054 mm; two independent routes)", () => {
    const n = benchmarkCut.flutes;
    const kn = benchmarkCut.specificForceNPerMm2 * benchmarkCut.radialForceRatio;
    const crit = criticalDepthOfCutMm({ stiffnessNPerMm: benchmarkCut.modes[0]!.stiffnessNPerMm, dampingRatio: 0.011, specificForceNPerMm2: (n * kn) / 4 });
    expect(crit).toBeCloseTo(0.298054, 5);
    const lobes = stabilityLobes({ ...benchmarkCut, radialImmersion: 1, minRpm: 8000, maxRpm: 60000, speeds: 4000 });
    const min = Math.min(...lobes.flatMap((p) => (p.limitingDepthMm === null ? [] : [p.limitingDepthMm])));
    expect(Math.abs(min / crit - 1)).toBeLessThan(1e-3);
  });
});
