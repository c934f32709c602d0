import { describe, expect, it } from "vitest";
import { dampingRatioFromHalfPower } from "./damping-ratio-from-half-power.js";

describe("dampingRatioFromHalfPower", () => {
  it("DMP-1: 475–525 Hz around 500 Hz → ζ 0.05, Q 10 (domain-reference DMP-1; Rao, from memory)", () => {
    const z = dampingRatioFromHalfPower({ lowerHz: 475, upperHz: 525, peakHz: 500 });
    expect(z).toBeCloseTo(0.05, 12);
    expect(1 / (2 * z)).toBeCloseTo(10, 9);
  });
  it("DMP-2: exact half-power points of a ζ = 0.05 receptance read 0.050126 with fn and 0.050252 with the peak (domain-reference DMP-2)", () => {
    expect(dampingRatioFromHalfPower({ lowerHz: 473.055, upperHz: 523.181, peakHz: 500 })).toBeCloseTo(0.050126, 5);
    expect(dampingRatioFromHalfPower({ lowerHz: 473.055, upperHz: 523.181, peakHz: 498.748 })).toBeCloseTo(0.050252, 5);
  });
  it("rejects reversed points", () => {
    expect(() => dampingRatioFromHalfPower({ lowerHz: 525, upperHz: 475, peakHz: 500 })).toThrow("dampingRatioFromHalfPower requires upperHz > lowerHz");
  });
});
