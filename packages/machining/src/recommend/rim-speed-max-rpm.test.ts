import { describe, expect, it } from "vitest";
import { rimSpeedMaxRpm } from "./rim-speed-max-rpm.js";

describe("rimSpeedMaxRpm (router-bit speed table; common practice, no published source — values from memory)", () => {
  it("sets no ceiling up to 1 in (25.4 mm)", () => {
    expect(rimSpeedMaxRpm({ diameterMm: 25.4 })).toBeNull();
  });
  it("steps at 2, 2.5 and 3.5 in", () => {
    expect(rimSpeedMaxRpm({ diameterMm: 40 })).toBe(18000);
    expect(rimSpeedMaxRpm({ diameterMm: 60 })).toBe(16000);
    expect(rimSpeedMaxRpm({ diameterMm: 80 })).toBe(12000);
  });
  it("holds the 3.5 in rim speed beyond (≈ 55.9 m/s): a 120 mm bit ≤ 8890 rpm", () => {
    const n = rimSpeedMaxRpm({ diameterMm: 120 })!;
    expect(n).toBeCloseTo((12000 * 88.9) / 120, 9);
    expect((Math.PI * 120 * n) / 60000).toBeCloseTo(55.86, 2);
  });
});
