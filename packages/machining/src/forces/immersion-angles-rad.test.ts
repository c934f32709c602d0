import { describe, expect, it } from "vitest";
import { immersionAnglesRad } from "./immersion-angles-rad.js";

describe("immersionAnglesRad", () => {
  it("half immersion: climb 90°→180°, conventional 0°→90° (Altintas convention, domain-reference §15)", () => {
    const c = immersionAnglesRad({ radialImmersion: 0.5, millingDirection: "climb" });
    expect(c.startRad).toBeCloseTo(Math.PI / 2, 12);
    expect(c.exitRad).toBe(Math.PI);
    const u = immersionAnglesRad({ radialImmersion: 0.5, millingDirection: "conventional" });
    expect(u.startRad).toBe(0);
    expect(u.exitRad).toBeCloseTo(Math.PI / 2, 12);
  });
  it("a slot spans 0→π either way", () => {
    for (const dir of ["climb", "conventional"] as const) {
      const a = immersionAnglesRad({ radialImmersion: 1, millingDirection: dir });
      expect(a.startRad).toBeCloseTo(0, 12);
      expect(a.exitRad).toBeCloseTo(Math.PI, 12);
    }
  });
  it("the arc length is the same for climb and conventional (arccos(1 − 2r))", () => {
    const r = 0.1;
    const c = immersionAnglesRad({ radialImmersion: r, millingDirection: "climb" });
    const u = immersionAnglesRad({ radialImmersion: r, millingDirection: "conventional" });
    expect(c.exitRad - c.startRad).toBeCloseTo(u.exitRad - u.startRad, 12);
    expect(u.exitRad).toBeCloseTo(Math.acos(0.8), 12);
  });
  it("rejects immersion outside (0, 1]", () => {
    expect(() => immersionAnglesRad({ radialImmersion: 1.2, millingDirection: "climb" })).toThrow(RangeError);
    expect(() => immersionAnglesRad({ radialImmersion: 0, millingDirection: "climb" })).toThrow(RangeError);
  });
});
