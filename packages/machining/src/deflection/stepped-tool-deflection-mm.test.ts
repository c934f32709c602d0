import { describe, expect, it } from "vitest";
import { steppedToolDeflectionMm } from "./stepped-tool-deflection-mm.js";
import { toolDeflectionMm } from "./tool-deflection-mm.js";

const tool = { stickoutMm: 30, fluteLengthMm: 20, fluteDiameterMm: 4.8, shankDiameterMm: 6, youngsModulusGPa: 600 };

describe("steppedToolDeflectionMm", () => {
  it("DEF-4: L 30, Lf 20 (De 4.8), shank Ø6, F 100 N → 0.0336485 mm, k 2971.90 N/mm (domain-reference DEF-4, COMPUTED)", () => {
    const d = steppedToolDeflectionMm({ forceN: 100, ...tool });
    expect(d).toBeCloseTo(0.0336485, 7);
    expect(100 / d).toBeCloseTo(2971.9, 1);
  });
  it("lies between the all-shank (0.0235785) and all-fluted (0.0575647 mm) bounds (domain-reference DEF-4)", () => {
    const shank = toolDeflectionMm({ forceN: 100, stickoutMm: 30, diameterMm: 6, youngsModulusGPa: 600 });
    const fluted = toolDeflectionMm({ forceN: 100, stickoutMm: 30, diameterMm: 4.8, youngsModulusGPa: 600 });
    expect(shank).toBeCloseTo(0.0235785, 7);
    expect(fluted).toBeCloseTo(0.0575647, 7);
    const d = steppedToolDeflectionMm({ forceN: 100, ...tool });
    expect(d).toBeGreaterThan(shank);
    expect(d).toBeLessThan(fluted);
  });
  it("DEF-5: the force that deflects the DEF-4 tool 0.025 mm is 74.2975 N (domain-reference DEF-5)", () => {
    const perN = steppedToolDeflectionMm({ forceN: 1, ...tool });
    expect(0.025 / perN).toBeCloseTo(74.2975, 3);
  });
  it("matches a numerical unit-load integral of M·m/(E·I) along the stepped beam (independent check)", () => {
    const steps = 200000;
    const e = 600000;
    let sum = 0;
    for (let i = 0; i < steps; i++) {
      const x = ((i + 0.5) / steps) * 30; // distance from the tip
      const d = x <= 20 ? 4.8 : 6;
      const inertia = (Math.PI * d ** 4) / 64;
      sum += ((100 * x * x) / (e * inertia)) * (30 / steps);
    }
    // Midpoint rule: the step in I at x = 20 mm limits agreement to ~1e-6 relative.
    expect(Math.abs(steppedToolDeflectionMm({ forceN: 100, ...tool }) / sum - 1)).toBeLessThan(1e-5);
  });
  it("a flute longer than the stick-out is the fluted cantilever", () => {
    expect(steppedToolDeflectionMm({ ...tool, fluteLengthMm: 40, forceN: 100 })).toBeCloseTo(toolDeflectionMm({ forceN: 100, stickoutMm: 30, diameterMm: 4.8, youngsModulusGPa: 600 }), 12);
  });
});
