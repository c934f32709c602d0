import { describe, expect, it } from "vitest";
import { spindleTorqueNm } from "./spindle-torque-nm.js";

describe("spindleTorqueNm", () => {
  it("PWR-2: 240 W at 18 000 rpm → 0.127324 N·m (domain-reference PWR-2, COMPUTED; 9549.3·P[kW]/n)", () => {
    expect(spindleTorqueNm({ powerW: 240, rpm: 18000 })).toBeCloseTo(0.127324, 6);
    expect(spindleTorqueNm({ powerW: 240, rpm: 18000 })).toBeCloseTo((9549.3 * 0.24) / 18000, 5);
  });
  it("PWR-3: 128.28 W at 400 rpm → 3.0625 N·m and 500 N at r = 6.125 mm (domain-reference PWR-3; Kalpakjian, FOUND-2nd)", () => {
    const t = spindleTorqueNm({ powerW: 128.28, rpm: 400 });
    expect(t).toBeCloseTo(3.0625, 3);
    expect(t / 0.006125).toBeCloseTo(500, 0);
  });
  it("rejects a stopped spindle", () => {
    expect(() => spindleTorqueNm({ powerW: 10, rpm: 0 })).toThrow("spindleTorqueNm requires rpm > 0");
  });
});
