import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { seriesStiffness } from "./series-stiffness.js";

describe("seriesStiffness", () => {
  it("CMP-1: 2, 5, 3, 4 ×10⁶ N/m in series → 779 220.8 N/m; 64.167 µm at 50 N; shares 38.96/15.58/25.97/19.48 % (domain-reference CMP-1)", () => {
    const ks = [2000, 5000, 3000, 4000]; // N/mm
    const k = seriesStiffness({ stiffnessesNPerMm: ks });
    expect(k * 1000).toBeCloseTo(779220.8, 1);
    expect((50 / k) * 1000).toBeCloseTo(64.167, 3);
    const shares = ks.map((ki) => (k / ki) * 100);
    [38.96, 15.58, 25.97, 19.48].forEach((s, i) => expect(shares[i]).toBeCloseTo(s, 2));
  });
  it("is never stiffer than the softest spring (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 1, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 8 }), (ks) => {
        const k = seriesStiffness({ stiffnessesNPerMm: ks });
        expect(k).toBeLessThanOrEqual(Math.min(...ks) * (1 + 1e-12));
        expect(k).toBeGreaterThan(0);
      }),
    );
  });
  it("rejects an empty list and a zero spring", () => {
    expect(() => seriesStiffness({ stiffnessesNPerMm: [] })).toThrow("seriesStiffness requires stiffnessesNPerMm to hold at least one value");
    expect(() => seriesStiffness({ stiffnessesNPerMm: [100, 0] })).toThrow("seriesStiffness requires stiffnessesNPerMm[1] > 0");
  });
});
