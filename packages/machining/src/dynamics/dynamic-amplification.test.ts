import { complex, divide, abs } from "mathjs";
import { describe, expect, it } from "vitest";
import { dynamicAmplification } from "./dynamic-amplification.js";

describe("dynamicAmplification", () => {
  it("TPF-4: 600 Hz against a 580 Hz mode with ζ 0.03 → 10.6757; at resonance 1/(2ζ) = 16.667 (domain-reference TPF-4)", () => {
    expect(dynamicAmplification({ frequencyHz: 600, naturalFrequencyHz: 580, dampingRatio: 0.03 })).toBeCloseTo(10.6757, 4);
    expect(dynamicAmplification({ frequencyHz: 580, naturalFrequencyHz: 580, dampingRatio: 0.03 })).toBeCloseTo(16.667, 3);
  });
  it("equals |1/(1 − r² + 2iζr)| computed with mathjs complex arithmetic (independent library)", () => {
    for (const r of [0, 0.3, 0.97, 1.4, 5]) {
      const ref = abs(divide(1, complex(1 - r * r, 2 * 0.05 * r)) as ReturnType<typeof complex>) as unknown as number;
      expect(dynamicAmplification({ frequencyHz: r * 200, naturalFrequencyHz: 200, dampingRatio: 0.05 })).toBeCloseTo(ref, 12);
    }
  });
});
