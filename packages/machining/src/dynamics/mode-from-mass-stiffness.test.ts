import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { dynamicAmplification } from "./dynamic-amplification.js";
import { modeFromMassStiffness } from "./mode-from-mass-stiffness.js";

describe("modeFromMassStiffness", () => {
  it("BELT-3: dual-belt gantry, 78.48 N/mm and 10 kg → 14.099 Hz (domain-reference BELT-3)", () => {
    const m = modeFromMassStiffness({ massKg: 10, stiffnessNPerMm: 78.48, dampingRatio: 0.05, direction: "x" });
    expect(m.frequencyHz).toBeCloseTo(14.099, 3);
    expect(m.stiffnessNPerMm).toBe(78.48);
    expect(m.dampingRatio).toBe(0.05);
    expect(m.direction).toBe("x");
  });
  it("more mass: lower frequency, and less response well above it (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 50, noNaN: true }), fc.double({ min: 1.1, max: 4, noNaN: true }), (mass, k) => {
        const light = modeFromMassStiffness({ massKg: mass, stiffnessNPerMm: 100, dampingRatio: 0.05, direction: "y" });
        const heavy = modeFromMassStiffness({ massKg: mass * k, stiffnessNPerMm: 100, dampingRatio: 0.05, direction: "y" });
        expect(heavy.frequencyHz).toBeLessThan(light.frequencyHz);
        const f = 5 * light.frequencyHz;
        expect(dynamicAmplification({ frequencyHz: f, naturalFrequencyHz: heavy.frequencyHz, dampingRatio: 0.05 })).toBeLessThan(
          dynamicAmplification({ frequencyHz: f, naturalFrequencyHz: light.frequencyHz, dampingRatio: 0.05 }),
        );
      }),
    );
  });
  it("rejects a damping ratio of 1", () => {
    expect(() => modeFromMassStiffness({ massKg: 1, stiffnessNPerMm: 1, dampingRatio: 1, direction: "x" })).toThrow(RangeError);
  });
});
