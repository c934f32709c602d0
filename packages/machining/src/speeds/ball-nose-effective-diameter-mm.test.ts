import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ballNoseEffectiveDiameterMm } from "./ball-nose-effective-diameter-mm.js";
import { spindleSpeedRpm } from "./spindle-speed-rpm.js";

describe("ballNoseEffectiveDiameterMm", () => {
  it("BN-1: D=10, ap=1 → 6 mm, and vc 300 m/min there needs 15 915.5 rpm (domain-reference BN-1, COMPUTED)", () => {
    const deff = ballNoseEffectiveDiameterMm({ diameterMm: 10, axialDepthMm: 1 });
    expect(deff).toBeCloseTo(6, 9);
    expect(spindleSpeedRpm({ cuttingSpeedMPerMin: 300, diameterMm: deff })).toBeCloseTo(15915.5, 1);
  });
  it("BN-2: D=6, ap=0.2 → 2.15407 mm (domain-reference BN-2)", () => {
    expect(ballNoseEffectiveDiameterMm({ diameterMm: 6, axialDepthMm: 0.2 })).toBeCloseTo(2.15407, 5);
  });
  it("BN-3: D=10, ap=1, tilt 15° → 7.86611 mm (domain-reference BN-3; tool makers' formula, from memory)", () => {
    expect(ballNoseEffectiveDiameterMm({ diameterMm: 10, axialDepthMm: 1, tiltDeg: 15 })).toBeCloseTo(7.86611, 5);
  });
  it("never exceeds D (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 50, noNaN: true }), fc.double({ min: 1e-4, max: 2, noNaN: true }), fc.double({ min: 0, max: 89, noNaN: true }), (d, r, tilt) => {
        const v = ballNoseEffectiveDiameterMm({ diameterMm: d, axialDepthMm: r * d, tiltDeg: tilt });
        expect(v).toBeGreaterThan(0);
        expect(v).toBeLessThanOrEqual(d);
      }),
    );
  });
  it("rejects a tilt of 90° or more", () => {
    expect(() => ballNoseEffectiveDiameterMm({ diameterMm: 6, axialDepthMm: 1, tiltDeg: 90 })).toThrow("ballNoseEffectiveDiameterMm requires tiltDeg < 90");
  });
});
