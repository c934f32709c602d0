import { describe, expect, it } from "vitest";
import { specificCuttingForceNPerMm2 } from "./specific-cutting-force-n-per-mm2.js";

describe("specificCuttingForceNPerMm2", () => {
  it("KZ-1: S235 (1780, 0.17) at h = 0.2 mm → 2340.157 N/mm², Fc = 936.063 N for b = 2 mm (domain-reference KZ-1; Tschätsch/Dietrich, FOUND-2nd)", () => {
    const kc = specificCuttingForceNPerMm2({ kc11NPerMm2: 1780, mc: 0.17, chipThicknessMm: 0.2 });
    expect(kc).toBeCloseTo(2340.157, 3);
    expect(2 * 0.2 * kc).toBeCloseTo(936.063, 3);
  });
  it("KZ-2: κr 45° → h = 0.141421 mm, kc 2482.175 N/mm², Fc 992.870 N (domain-reference KZ-2, COMPUTED)", () => {
    const h = 0.2 * Math.sin(Math.PI / 4);
    const b = 2 / Math.sin(Math.PI / 4);
    const kc = specificCuttingForceNPerMm2({ kc11NPerMm2: 1780, mc: 0.17, chipThicknessMm: h });
    expect(kc).toBeCloseTo(2482.175, 3);
    expect(b * h * kc).toBeCloseTo(992.87, 3);
  });
  it("KZ-3: ap 3, f 0.3 → kc 2184.285, Fc 1965.857 N (domain-reference KZ-3)", () => {
    const kc = specificCuttingForceNPerMm2({ kc11NPerMm2: 1780, mc: 0.17, chipThicknessMm: 0.3 });
    expect(kc).toBeCloseTo(2184.285, 3);
    expect(3 * 0.3 * kc).toBeCloseTo(1965.857, 3);
  });
  it("KZ-4: C45E (2220, 0.14) at h 0.2 → 2781.050 N/mm² (domain-reference KZ-4; Kienzle constants from memory)", () => {
    expect(specificCuttingForceNPerMm2({ kc11NPerMm2: 2220, mc: 0.14, chipThicknessMm: 0.2 })).toBeCloseTo(2781.05, 3);
  });
  it("KZ-5: aluminium (VDI 3323 700, 0.25) at h_m 0.03108 mm → 1667.162 N/mm² (domain-reference KZ-5)", () => {
    expect(specificCuttingForceNPerMm2({ kc11NPerMm2: 700, mc: 0.25, chipThicknessMm: 0.03108 })).toBeCloseTo(1667.162, 2);
  });
  it("equals kc1.1 at h = 1 mm by definition", () => {
    expect(specificCuttingForceNPerMm2({ kc11NPerMm2: 1500, mc: 0.22, chipThicknessMm: 1 })).toBe(1500);
  });
  it("rejects mc ≥ 1 and zero chips", () => {
    expect(() => specificCuttingForceNPerMm2({ kc11NPerMm2: 1500, mc: 1, chipThicknessMm: 0.1 })).toThrow("specificCuttingForceNPerMm2 requires 0 <= mc < 1");
    expect(() => specificCuttingForceNPerMm2({ kc11NPerMm2: 1500, mc: 0.2, chipThicknessMm: 0 })).toThrow("specificCuttingForceNPerMm2 requires chipThicknessMm > 0");
  });
});
