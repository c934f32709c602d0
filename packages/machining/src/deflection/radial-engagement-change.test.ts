import { describe, expect, it } from "vitest";
import { materialRemovalRateMm3PerMin } from "../speeds/material-removal-rate-mm3-per-min.js";
import { radialEngagementChange } from "./radial-engagement-change.js";

describe("radialEngagementChange — deep-narrow vs shallow-wide", () => {
  it("δ = 0.1 mm on a 6.35 mm cutter: +100 % at ae 0.1 mm, +20 % at ae 0.5 mm, whatever the axial depth (geometric model, worked check of the issue)", () => {
    expect(radialEngagementChange({ deflectionMm: 0.1, radialDepthMm: 0.1 })).toBeCloseTo(1.0, 12);
    expect(radialEngagementChange({ deflectionMm: 0.1, radialDepthMm: 0.5 })).toBeCloseTo(0.2, 12);
  });

  it("at equal removal rate the deep narrow cut suffers five times the relative change", () => {
    const vf = 1200;
    const deepNarrow = { axialDepthMm: 5, radialDepthMm: 0.1 };
    const shallowWide = { axialDepthMm: 1, radialDepthMm: 0.5 };
    // Same removal rate: 5 × 0.1 = 1 × 0.5 mm² of cross-section.
    expect(materialRemovalRateMm3PerMin({ ...deepNarrow, feedMmPerMin: vf })).toBeCloseTo(materialRemovalRateMm3PerMin({ ...shallowWide, feedMmPerMin: vf }), 9);
    const dn = radialEngagementChange({ deflectionMm: 0.1, radialDepthMm: deepNarrow.radialDepthMm });
    const sw = radialEngagementChange({ deflectionMm: 0.1, radialDepthMm: shallowWide.radialDepthMm });
    expect(dn / sw).toBeCloseTo(5, 12);
    // The chip-thinning geometry of the 6.35 mm cutter: the engaged arc grows by more than half at
    // ae 0.1 → 0.2 mm but only by a tenth at ae 0.5 → 0.6 mm (arccos(1 − 2ae/D), computed here).
    const arc = (ae: number): number => Math.acos(1 - (2 * ae) / 6.35);
    expect(arc(0.2) / arc(0.1)).toBeGreaterThan(1.4);
    expect(arc(0.6) / arc(0.5)).toBeLessThan(1.1);
  });

  it("rejects a zero stepover", () => {
    expect(() => radialEngagementChange({ deflectionMm: 0.1, radialDepthMm: 0 })).toThrow("radialEngagementChange requires radialDepthMm > 0");
  });
});
