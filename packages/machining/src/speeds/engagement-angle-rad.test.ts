import { describe, expect, it } from "vitest";
import { engagementAngleRad } from "./engagement-angle-rad.js";

const deg = (rad: number): number => (rad * 180) / Math.PI;

describe("engagementAngleRad", () => {
  it("CT-1: D=10, ae=1 → 36.870° (domain-reference CT-1, COMPUTED)", () => {
    expect(deg(engagementAngleRad({ diameterMm: 10, radialDepthMm: 1 }))).toBeCloseTo(36.87, 3);
  });
  it("CT-2: D=6, ae=0.3 → 25.842° (domain-reference CT-2)", () => {
    expect(deg(engagementAngleRad({ diameterMm: 6, radialDepthMm: 0.3 }))).toBeCloseTo(25.842, 3);
  });
  it("CT-3 / CT-4: quarter immersion 60°, half 90°, slot 180°", () => {
    expect(deg(engagementAngleRad({ diameterMm: 10, radialDepthMm: 2.5 }))).toBeCloseTo(60, 9);
    expect(deg(engagementAngleRad({ diameterMm: 12, radialDepthMm: 6 }))).toBeCloseTo(90, 9);
    expect(deg(engagementAngleRad({ diameterMm: 12, radialDepthMm: 12 }))).toBeCloseTo(180, 9);
  });
  it("rejects ae > D", () => {
    expect(() => engagementAngleRad({ diameterMm: 5, radialDepthMm: 6 })).toThrow("engagementAngleRad requires radialDepthMm <= diameterMm");
  });
});
