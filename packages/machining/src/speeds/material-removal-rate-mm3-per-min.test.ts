import convert from "convert-units";
import { describe, expect, it } from "vitest";
import { materialRemovalRateMm3PerMin } from "./material-removal-rate-mm3-per-min.js";

describe("materialRemovalRateMm3PerMin", () => {
  it("MRR-1: ap 5 × ae 2 × vf 1800 = 18 cm³/min = 300 mm³/s (domain-reference MRR-1; SME MRR = F·W·t, FOUND)", () => {
    const q = materialRemovalRateMm3PerMin({ axialDepthMm: 5, radialDepthMm: 2, feedMmPerMin: 1800 });
    expect(q).toBeCloseTo(18000, 9);
    expect(q / 60).toBeCloseTo(300, 9);
    // convert-units (independent library) for the volume unit: 18 000 mm³ = 18 cm³.
    expect(convert(q).from("mm3").to("cm3")).toBeCloseTo(18, 9);
  });
  it("rejects a zero feed", () => {
    expect(() => materialRemovalRateMm3PerMin({ axialDepthMm: 1, radialDepthMm: 1, feedMmPerMin: 0 })).toThrow("materialRemovalRateMm3PerMin requires feedMmPerMin > 0");
  });
});
