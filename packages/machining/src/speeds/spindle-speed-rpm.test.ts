import fc from "fast-check";
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { cuttingSpeedMPerMin } from "./cutting-speed-m-per-min.js";
import { spindleSpeedRpm } from "./spindle-speed-rpm.js";

describe("spindleSpeedRpm", () => {
  it("SPD-1: vc 300 m/min on Ø6 mm gives 15 915.494 rpm (domain-reference SPD-1; Machinery's Handbook formula, from memory)", () => {
    expect(spindleSpeedRpm({ cuttingSpeedMPerMin: 300, diameterMm: 6 })).toBeCloseTo(15915.494, 3);
  });

  it("SPD-2: vc 200 m/min on Ø10 mm gives 6366.198 rpm (domain-reference SPD-2, COMPUTED)", () => {
    expect(spindleSpeedRpm({ cuttingSpeedMPerMin: 200, diameterMm: 10 })).toBeCloseTo(6366.198, 3);
  });

  it("SPD-3: 500 sfm on a 0.5 in cutter is 3819.719 rpm, the inch formula N = 12V/(πD) (domain-reference SPD-3; SME ch. 118, FOUND)", () => {
    // Inputs converted with mathjs (independent library), not with the engine's own units table.
    const vc = unit(500, "ft/minute").toNumber("m/minute");
    const d = unit(0.5, "inch").toNumber("mm");
    expect(spindleSpeedRpm({ cuttingSpeedMPerMin: vc, diameterMm: d })).toBeCloseTo(3819.719, 3);
    // The shop shortcut N ≈ 3.82·V/D lands within 0.01 %.
    expect(spindleSpeedRpm({ cuttingSpeedMPerMin: vc, diameterMm: d }) / ((3.82 * 500) / 0.5)).toBeCloseTo(1, 3);
  });

  it("inverts cuttingSpeedMPerMin (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 5000, noNaN: true }), fc.double({ min: 0.1, max: 200, noNaN: true }), (vc, d) => {
        const n = spindleSpeedRpm({ cuttingSpeedMPerMin: vc, diameterMm: d });
        expect(Number.isFinite(n)).toBe(true);
        expect(cuttingSpeedMPerMin({ rpm: n, diameterMm: d })).toBeCloseTo(vc, 6);
      }),
    );
  });

  it("rejects impossible input with the standard message", () => {
    expect(() => spindleSpeedRpm({ cuttingSpeedMPerMin: 0, diameterMm: 6 })).toThrow(new RangeError("spindleSpeedRpm requires cuttingSpeedMPerMin > 0"));
    expect(() => spindleSpeedRpm({ cuttingSpeedMPerMin: 100, diameterMm: -1 })).toThrow(new RangeError("spindleSpeedRpm requires diameterMm > 0"));
    expect(() => spindleSpeedRpm({ cuttingSpeedMPerMin: Number.NaN, diameterMm: 6 })).toThrow(RangeError);
    expect(() => spindleSpeedRpm({ cuttingSpeedMPerMin: Number.POSITIVE_INFINITY, diameterMm: 6 })).toThrow(RangeError);
  });
});
