import { describe, expect, it } from "vitest";
import { naturalFrequencyHz } from "./natural-frequency-hz.js";

describe("naturalFrequencyHz", () => {
  it("FN-1: 8 kg on 2.0e5 N/m → 25.1646 Hz (domain-reference FN-1; Rao / Inman, from memory)", () => {
    expect(naturalFrequencyHz({ stiffnessNPerMm: 200, massKg: 8 })).toBeCloseTo(25.1646, 4);
  });
  it("FN-2 / FN-3 inverses: 1 340 049.65 N/m with 0.03993 kg → 922 Hz; 197 392.09 N/m with 8 kg → 25 Hz", () => {
    expect(naturalFrequencyHz({ stiffnessNPerMm: 1340.04965, massKg: 0.03993 })).toBeCloseTo(922, 3);
    expect(naturalFrequencyHz({ stiffnessNPerMm: 197.39209, massKg: 8 })).toBeCloseTo(25, 5);
  });
  it("BELT-3: a 10 kg gantry on 78 480 N/m of belts → 14.099 Hz; 240 000 N/m → 24.656 Hz (domain-reference BELT-3)", () => {
    expect(naturalFrequencyHz({ stiffnessNPerMm: 78.48, massKg: 10 })).toBeCloseTo(14.099, 3);
    expect(naturalFrequencyHz({ stiffnessNPerMm: 240, massKg: 10 })).toBeCloseTo(24.656, 3);
  });
  it("adding mass lowers the mode by √(m0/m1)", () => {
    expect(naturalFrequencyHz({ stiffnessNPerMm: 100, massKg: 8 }) / naturalFrequencyHz({ stiffnessNPerMm: 100, massKg: 2 })).toBeCloseTo(0.5, 12);
  });
  it("rejects zero mass", () => {
    expect(() => naturalFrequencyHz({ stiffnessNPerMm: 100, massKg: 0 })).toThrow("naturalFrequencyHz requires massKg > 0");
  });
});
