import { describe, expect, it } from "vitest";
import { ballNoseEffectiveDiameterMm } from "./ball-nose-effective-diameter-mm.js";
import { cornerRadiusEffectiveDiameterMm } from "./corner-radius-effective-diameter-mm.js";

describe("cornerRadiusEffectiveDiameterMm", () => {
  it("D=10, r=1, ap=0.5 → 10 − 2 + 2·√(1 − 0.25) = 9.7320508 mm (hand calculation, geometry)", () => {
    expect(cornerRadiusEffectiveDiameterMm({ diameterMm: 10, cornerRadiusMm: 1, axialDepthMm: 0.5 })).toBeCloseTo(8 + 2 * Math.sqrt(0.75), 12);
  });
  it("with r = D/2 it is the ball-nose formula (BN-1, BN-2 of domain-reference)", () => {
    expect(cornerRadiusEffectiveDiameterMm({ diameterMm: 10, cornerRadiusMm: 5, axialDepthMm: 1 })).toBeCloseTo(6, 9);
    expect(cornerRadiusEffectiveDiameterMm({ diameterMm: 6, cornerRadiusMm: 3, axialDepthMm: 0.2 })).toBeCloseTo(
      ballNoseEffectiveDiameterMm({ diameterMm: 6, axialDepthMm: 0.2 }),
      12,
    );
  });
  it("is the full diameter at or below the corner", () => {
    expect(cornerRadiusEffectiveDiameterMm({ diameterMm: 10, cornerRadiusMm: 1, axialDepthMm: 3 })).toBe(10);
  });
  it("rejects a corner radius above D/2", () => {
    expect(() => cornerRadiusEffectiveDiameterMm({ diameterMm: 10, cornerRadiusMm: 6, axialDepthMm: 1 })).toThrow(
      "cornerRadiusEffectiveDiameterMm requires cornerRadiusMm <= diameterMm / 2",
    );
  });
});
