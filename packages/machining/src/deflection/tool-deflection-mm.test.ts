import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { toolDeflectionMm } from "./tool-deflection-mm.js";

describe("toolDeflectionMm", () => {
  it("DEF-1: Ø6 carbide (600 GPa), L 25, F 50 N → 0.0068225 mm, k = 7328.71 N/mm (domain-reference DEF-1; cantilever δ = FL³/3EI)", () => {
    const d = toolDeflectionMm({ forceN: 50, stickoutMm: 25, diameterMm: 6, youngsModulusGPa: 600 });
    expect(d).toBeCloseTo(0.0068225, 7);
    expect(50 / d).toBeCloseTo(7328.71, 1);
  });
  it("DEF-2: same in HSS (210 GPa) → 0.0194928 mm (domain-reference DEF-2)", () => {
    expect(toolDeflectionMm({ forceN: 50, stickoutMm: 25, diameterMm: 6, youngsModulusGPa: 210 })).toBeCloseTo(0.0194928, 7);
  });
  it("DEF-3: fluted over the whole length, De = 0.8·6 = 4.8 mm → 0.0166565 mm (domain-reference DEF-3; Kops & Vo 1990, FOUND)", () => {
    expect(toolDeflectionMm({ forceN: 50, stickoutMm: 25, diameterMm: 4.8, youngsModulusGPa: 600 })).toBeCloseTo(0.0166565, 7);
  });
  it("DEF-6: 1/8 in carbide fluted (De 2.54 mm), L 20 → k 459.714 N/mm; 11.677 N gives 0.001 in (domain-reference DEF-6)", () => {
    const d1 = toolDeflectionMm({ forceN: 1, stickoutMm: 20, diameterMm: 2.54, youngsModulusGPa: 600 });
    expect(1 / d1).toBeCloseTo(459.714, 2);
    expect(0.0254 / d1).toBeCloseTo(11.677, 2);
  });
  it("deflection scales with stick-out cubed and linearly with force (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 500, noNaN: true }),
        fc.double({ min: 5, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 25, noNaN: true }),
        fc.double({ min: 1.01, max: 3, noNaN: true }),
        (f, l, d, k) => {
          const base = toolDeflectionMm({ forceN: f, stickoutMm: l, diameterMm: d, youngsModulusGPa: 600 });
          expect(toolDeflectionMm({ forceN: f, stickoutMm: l * k, diameterMm: d, youngsModulusGPa: 600 }) / base).toBeCloseTo(k ** 3, 9);
          expect(toolDeflectionMm({ forceN: f * k, stickoutMm: l, diameterMm: d, youngsModulusGPa: 600 }) / base).toBeCloseTo(k, 9);
        },
      ),
    );
  });
  it("rejects a zero modulus", () => {
    expect(() => toolDeflectionMm({ forceN: 1, stickoutMm: 10, diameterMm: 3, youngsModulusGPa: 0 })).toThrow("toolDeflectionMm requires youngsModulusGPa > 0");
  });
});
