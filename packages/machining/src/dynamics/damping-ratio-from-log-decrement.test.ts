import { describe, expect, it } from "vitest";
import { dampingRatioFromLogDecrement } from "./damping-ratio-from-log-decrement.js";

describe("dampingRatioFromLogDecrement", () => {
  // domain-reference §11 (Rao §2.6 from memory; formulas FOUND on encyclopedic pages)
  it("DMP-3: 1.0 → 0.5 over 5 cycles: ζ 0.0220582", () => {
    expect(dampingRatioFromLogDecrement({ firstAmplitude: 1, laterAmplitude: 0.5, cycles: 5 })).toBeCloseTo(0.0220582, 7);
  });
  it("DMP-4: ratio 0.8 in one cycle: ζ 0.0354920", () => {
    expect(dampingRatioFromLogDecrement({ firstAmplitude: 1, laterAmplitude: 0.8, cycles: 1 })).toBeCloseTo(0.035492, 7);
  });
  it("DMP-5: 2.0 → 0.2 over 10 cycles: ζ 0.0366222", () => {
    expect(dampingRatioFromLogDecrement({ firstAmplitude: 2, laterAmplitude: 0.2, cycles: 10 })).toBeCloseTo(0.0366222, 7);
  });
  it("recovers ζ from an exact free decay e^(−ζωn t) sampled one damped period apart", () => {
    const zeta = 0.04;
    const wn = 2 * Math.PI * 100;
    const td = (2 * Math.PI) / (wn * Math.sqrt(1 - zeta * zeta));
    const x = (t: number): number => Math.exp(-zeta * wn * t);
    expect(dampingRatioFromLogDecrement({ firstAmplitude: x(0), laterAmplitude: x(7 * td), cycles: 7 })).toBeCloseTo(zeta, 12);
  });
  it("rejects a growing signal", () => {
    expect(() => dampingRatioFromLogDecrement({ firstAmplitude: 1, laterAmplitude: 1.2, cycles: 1 })).toThrow("dampingRatioFromLogDecrement requires laterAmplitude < firstAmplitude");
  });
});
