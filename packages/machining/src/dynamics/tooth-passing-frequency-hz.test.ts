import { describe, expect, it } from "vitest";
import { toothPassingFrequencyHz } from "./tooth-passing-frequency-hz.js";

describe("toothPassingFrequencyHz", () => {
  it("TPF-1..3: 2 × 18 000 → 600 Hz; 3 × 24 000 → 1200 Hz; 1 × 12 000 → 200 Hz; 4 × 30 000 → 2000 Hz (domain-reference TPF-1..3)", () => {
    expect(toothPassingFrequencyHz({ rpm: 18000, flutes: 2 })).toBe(600);
    expect(toothPassingFrequencyHz({ rpm: 24000, flutes: 3 })).toBe(1200);
    expect(toothPassingFrequencyHz({ rpm: 12000, flutes: 1 })).toBe(200);
    expect(toothPassingFrequencyHz({ rpm: 30000, flutes: 4 })).toBe(2000);
  });
  it("rejects zero flutes", () => {
    expect(() => toothPassingFrequencyHz({ rpm: 1000, flutes: 0 })).toThrow("toothPassingFrequencyHz requires flutes to be an integer >= 1");
  });
});
