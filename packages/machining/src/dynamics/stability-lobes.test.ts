import { describe, expect, it } from "vitest";
import { limitingDepthAtChatterFrequency } from "./limiting-depth-at-chatter-frequency.js";
import { stabilityLobes } from "./stability-lobes.js";
import { benchmarkCut, zoa3Cut } from "./test-systems.fixture.js";

const depths = (pts: ReturnType<typeof stabilityLobes>): number[] => pts.flatMap((p) => (p.limitingDepthMm === null ? [] : [p.limitingDepthMm]));
const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe("stabilityLobes", () => {
  const slot = stabilityLobes({ ...zoa3Cut, radialImmersion: 1, minRpm: 900, maxRpm: 20000 });

  it("returns 1000 speeds from minRpm to maxRpm by default, all with a finite boundary here", () => {
    expect(slot).toHaveLength(1000);
    expect(slot[0]!.rpm).toBe(900);
    expect(slot[999]!.rpm).toBeCloseTo(20000, 9);
    expect(depths(slot)).toHaveLength(1000);
    expect(depths(slot).every((d) => d > 0 && Number.isFinite(d))).toBe(true);
  });

  it("ZOA-3: the lowest point of the slot diagram is a_lim,min = 0.124496 mm (domain-reference ZOA-3)", () => {
    const fine = stabilityLobes({ ...zoa3Cut, radialImmersion: 1, minRpm: 16500, maxRpm: 17100, speeds: 601 });
    expect(rel(Math.min(...depths(fine)), 0.124496)).toBeLessThan(2e-4);
    expect(Math.min(...depths(slot))).toBeGreaterThan(0.124496 * (1 - 2e-4));
  });

  it("ZOA-4: at 6296.4 rpm the boundary is 0.13648 mm on lobe k = 1 (domain-reference ZOA-4 row fc 605 Hz)", () => {
    const p = stabilityLobes({ ...zoa3Cut, radialImmersion: 1, minRpm: 6296.4, maxRpm: 6296.5, speeds: 2 })[0]!;
    expect(rel(p.limitingDepthMm!, 0.13648)).toBeLessThan(5e-4);
    expect(p.lobeIndex).toBe(1);
    expect(p.chatterFrequencyHz).toBeCloseTo(605, 0);
  });

  it("ZOA-5: half immersion, branches tracked by continuity: minimum 0.325564 mm, never below it (domain-reference ZOA-5 and its §15 pitfall)", () => {
    const half = stabilityLobes({ ...zoa3Cut, radialImmersion: 0.5, millingDirection: "climb", minRpm: 3000, maxRpm: 30000, speeds: 3000 });
    const d = depths(half);
    expect(rel(Math.min(...d), 0.325564)).toBeLessThan(1e-3);
    // Every envelope point lies on a true boundary: re-evaluating the exact ZOA at its chatter
    // frequency returns the same depth on one branch (no stitched, mis-ordered branches).
    for (const p of half.filter((_, i) => i % 97 === 0)) {
      const exact = limitingDepthAtChatterFrequency({ ...zoa3Cut, radialImmersion: 0.5, millingDirection: "climb", chatterFrequencyHz: p.chatterFrequencyHz! });
      const best = Math.min(...exact.map((b) => rel(b.limitingDepthMm, p.limitingDepthMm!)));
      expect(best).toBeLessThan(5e-3);
    }
  });

  it("ZOA-6: 1-DOF benchmark slot minimum 0.298054 mm; ZOA-7 half up-milling 0.204858 mm; ZOA-8 half down-milling 0.640908 mm", () => {
    const lo = 5000;
    const hi = 60000;
    const s = stabilityLobes({ ...benchmarkCut, radialImmersion: 1, minRpm: lo, maxRpm: hi, speeds: 6000 });
    expect(rel(Math.min(...depths(s)), 0.298054)).toBeLessThan(1e-3);
    const up = stabilityLobes({ ...benchmarkCut, radialImmersion: 0.5, millingDirection: "conventional", minRpm: lo, maxRpm: hi, speeds: 6000 });
    expect(rel(Math.min(...depths(up)), 0.204858)).toBeLessThan(1e-3);
    const down = stabilityLobes({ ...benchmarkCut, radialImmersion: 0.5, millingDirection: "climb", minRpm: lo, maxRpm: hi, speeds: 6000 });
    expect(rel(Math.min(...depths(down)), 0.640908)).toBeLessThan(1e-3);
  });

  it("15a: matches the semi-discretization cross-check values within the stated agreement (domain-reference §15a, COMPUTED)", () => {
    // ZOA-3 slot vs SD within 0.3 %: ZOA values 0.1246 / 0.1366 / 0.2161 at 5900 / 6300 / 7000 rpm.
    const at = (rpm: number): number => stabilityLobes({ ...zoa3Cut, radialImmersion: 1, minRpm: rpm, maxRpm: rpm + 0.01, speeds: 2 })[0]!.limitingDepthMm!;
    expect(rel(at(5900), 0.1246)).toBeLessThan(3e-3);
    expect(rel(at(6300), 0.1366)).toBeLessThan(3e-3);
    expect(rel(at(7000), 0.2161)).toBeLessThan(3e-3);
  });

  it("rejects an empty mode list and a reversed speed range", () => {
    expect(() => stabilityLobes({ ...zoa3Cut, modes: [], radialImmersion: 1, minRpm: 1000, maxRpm: 2000 })).toThrow("stabilityLobes requires modes to hold at least one mode");
    expect(() => stabilityLobes({ ...zoa3Cut, radialImmersion: 1, minRpm: 3000, maxRpm: 2000 })).toThrow("stabilityLobes requires maxRpm > minRpm");
  });
});
