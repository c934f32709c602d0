import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { cuttingSpeedMPerMin } from "./cutting-speed-m-per-min.js";

describe("cuttingSpeedMPerMin", () => {
  it("SPD-4: a 0.25 in cutter at 18 000 rpm runs at 1178.097 sfm (domain-reference SPD-4, COMPUTED from V = πDN/12)", () => {
    const v = cuttingSpeedMPerMin({ rpm: 18000, diameterMm: unit(0.25, "inch").toNumber("mm") });
    expect(unit(v, "m/minute").toNumber("ft/minute")).toBeCloseTo(1178.097, 3);
  });

  it("SPD-5: Ø12.5 mm work at 400 rpm gives 15.708 m/min (domain-reference SPD-5; Kalpakjian & Schmid turning example, FOUND-2nd)", () => {
    expect(cuttingSpeedMPerMin({ rpm: 400, diameterMm: 12.5 })).toBeCloseTo(15.708, 3);
  });

  it("rejects a zero speed", () => {
    expect(() => cuttingSpeedMPerMin({ rpm: 0, diameterMm: 6 })).toThrow("cuttingSpeedMPerMin requires rpm > 0");
  });
});
