import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chipThinningFactor } from "./chip-thinning-factor.js";
import { engagementAngleRad } from "./engagement-angle-rad.js";

describe("chipThinningFactor", () => {
  // domain-reference §2 (geometry COMPUTED; Altintas, Manufacturing Automation ch. 2, from memory)
  it.each([
    ["CT-1", 10, 1, 1.6667],
    ["CT-2", 6, 0.3, 2.29416],
    ["CT-2 (same ratio)", 10, 0.5, 2.29416],
    ["CT-3", 10, 2.5, 1.1547],
    ["CT-4", 12, 6, 1.0],
  ])("%s: D=%d mm, ae=%d mm → %d", (_id, d, ae, expected) => {
    expect(chipThinningFactor({ diameterMm: d, radialDepthMm: ae })).toBeCloseTo(expected, 4);
  });

  it("equals 1 / sin φe of the engagement angle below half immersion", () => {
    const phi = engagementAngleRad({ diameterMm: 10, radialDepthMm: 1 });
    expect(chipThinningFactor({ diameterMm: 10, radialDepthMm: 1 })).toBeCloseTo(1 / Math.sin(phi), 12);
  });

  it("is ≥ 1 and does not increase with the stepover (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 100, noNaN: true }), fc.double({ min: 1e-4, max: 1, noNaN: true }), fc.double({ min: 1e-4, max: 1, noNaN: true }), (d, r1, r2) => {
        const [lo, hi] = r1 < r2 ? [r1, r2] : [r2, r1];
        const fLo = chipThinningFactor({ diameterMm: d, radialDepthMm: lo * d });
        const fHi = chipThinningFactor({ diameterMm: d, radialDepthMm: hi * d });
        expect(fLo).toBeGreaterThanOrEqual(1);
        expect(fHi).toBeGreaterThanOrEqual(1);
        expect(fLo).toBeGreaterThanOrEqual(fHi * (1 - 1e-12));
        expect(Number.isFinite(fLo)).toBe(true);
      }),
    );
  });

  it("rejects a stepover wider than the cutter", () => {
    expect(() => chipThinningFactor({ diameterMm: 6, radialDepthMm: 7 })).toThrow("chipThinningFactor requires radialDepthMm <= diameterMm");
    expect(() => chipThinningFactor({ diameterMm: 6, radialDepthMm: 0 })).toThrow("chipThinningFactor requires radialDepthMm > 0");
  });
});
