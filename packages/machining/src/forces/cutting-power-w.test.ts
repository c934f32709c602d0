import { describe, expect, it } from "vitest";
import { cuttingPowerW } from "./cutting-power-w.js";

describe("cuttingPowerW", () => {
  it("PWR-1: u 0.8 J/mm³ × 300 mm³/s = 240 W; steel u 1.6 → 480 W (domain-reference PWR-1; Groover unit-power table, FOUND-2nd)", () => {
    expect(cuttingPowerW({ specificEnergyJPerMm3: 0.8, materialRemovalRateMm3PerMin: 300 * 60 })).toBeCloseTo(240, 9);
    expect(cuttingPowerW({ specificEnergyJPerMm3: 1.6, materialRemovalRateMm3PerMin: 300 * 60 })).toBeCloseTo(480, 9);
  });
  it("KZ-5: Pc/Q = kc(h_m): 1.66716 J/mm³ × 318.310 mm³/s = 530.67 W (domain-reference KZ-5, COMPUTED)", () => {
    expect(cuttingPowerW({ specificEnergyJPerMm3: 1667.162 / 1000, materialRemovalRateMm3PerMin: 318.31 * 60 })).toBeCloseTo(530.674, 2);
  });
  it("PWR-3: stainless u 4 J/mm³ at 32.0704 mm³/s = 128.28 W (domain-reference PWR-3; Kalpakjian example, FOUND-2nd)", () => {
    expect(cuttingPowerW({ specificEnergyJPerMm3: 4, materialRemovalRateMm3PerMin: 32.0704 * 60 })).toBeCloseTo(128.28, 2);
  });
  it("PWR-5: MH inch method Kp 0.69 hp·min/in³ × 1 in³/min × W 1.25 = 0.8625 hp (domain-reference PWR-5; MH, from memory)", () => {
    const jPerMm3 = (0.69 * 1.25 * 745.69987158227022 * 60) / 16387.064;
    const w = cuttingPowerW({ specificEnergyJPerMm3: jPerMm3, materialRemovalRateMm3PerMin: 16387.064 });
    expect(w / 745.69987158227022).toBeCloseTo(0.8625, 9);
  });
  it("rejects zero removal", () => {
    expect(() => cuttingPowerW({ specificEnergyJPerMm3: 1, materialRemovalRateMm3PerMin: 0 })).toThrow("cuttingPowerW requires materialRemovalRateMm3PerMin > 0");
  });
});
