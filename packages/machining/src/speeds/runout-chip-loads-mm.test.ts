import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { runoutChipLoadsMm } from "./runout-chip-loads-mm.js";

describe("runoutChipLoadsMm", () => {
  it("two flutes: one takes fz + TIR, the other fz − TIR (hand calculation from r = ±TIR/2)", () => {
    const r = runoutChipLoadsMm({ chipLoadMm: 0.05, flutes: 2, runoutTirMm: 0.02 });
    expect(r.maxMm).toBeCloseTo(0.07, 12);
    expect(r.minMm).toBeCloseTo(0.03, 12);
    expect(r.loadFactor).toBeCloseTo(1.4, 12);
  });
  it("four flutes, worst phase: fz ± TIR·sin(45°) (hand calculation, radii ±0.7071·TIR/2)", () => {
    const r = runoutChipLoadsMm({ chipLoadMm: 0.05, flutes: 4, runoutTirMm: 0.02 });
    expect(r.maxMm).toBeCloseTo(0.05 + 0.02 * Math.SQRT1_2, 12);
    expect(r.minMm).toBeCloseTo(0.05 - 0.02 * Math.SQRT1_2, 12);
  });
  it("runout larger than the feed leaves a flute idle and gives the other at most 2·fz", () => {
    const r = runoutChipLoadsMm({ chipLoadMm: 0.01, flutes: 2, runoutTirMm: 0.03 });
    expect(r.minMm).toBe(0);
    expect(r.maxMm).toBeCloseTo(0.02, 12);
  });
  it("a single flute and a true-running cutter are unaffected", () => {
    expect(runoutChipLoadsMm({ chipLoadMm: 0.1, flutes: 1, runoutTirMm: 0.05 }).perFluteMm).toEqual([0.1]);
    expect(runoutChipLoadsMm({ chipLoadMm: 0.1, flutes: 3, runoutTirMm: 0 }).perFluteMm.every((h) => Math.abs(h - 0.1) < 1e-15)).toBe(true);
  });
  it("conserves the material removed: the per-flute chips sum to z·fz while every flute cuts (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.double({ min: 0.01, max: 0.3, noNaN: true }), fc.double({ min: 0, max: 0.5, noNaN: true }), (z, fz, rel) => {
        const tir = rel * fz; // small enough that no flute goes idle for z ≥ 2 (TIR·sin(π/z) < fz)
        const r = runoutChipLoadsMm({ chipLoadMm: fz, flutes: z, runoutTirMm: tir });
        const sum = r.perFluteMm.reduce((a, b) => a + b, 0);
        expect(sum).toBeCloseTo(z * fz, 9);
        expect(r.maxMm).toBeGreaterThanOrEqual(fz - 1e-15);
      }),
    );
  });
  it("rejects negative runout", () => {
    expect(() => runoutChipLoadsMm({ chipLoadMm: 0.1, flutes: 2, runoutTirMm: -0.01 })).toThrow("runoutChipLoadsMm requires runoutTirMm >= 0");
  });
});
