import { describe, expect, it } from "vitest";
import { parabolicPeak } from "./parabolic-peak.js";

describe("parabolicPeak", () => {
  it("recovers the vertex of a Gaussian exactly (its log is a parabola; J. O. Smith, from memory)", () => {
    const centre = 0.3;
    const g = (k: number): number => 5 * Math.exp(-((k - centre) ** 2) / 2);
    const p = parabolicPeak({ below: g(-1), centre: g(0), above: g(1) });
    expect(p.offsetBins).toBeCloseTo(centre, 12);
    expect(p.height).toBeCloseTo(5, 12);
  });
  it("is scale-free: magnitude or power give the same offset", () => {
    const a = parabolicPeak({ below: 2, centre: 5, above: 3 });
    const b = parabolicPeak({ below: 4, centre: 25, above: 9 });
    expect(a.offsetBins).toBeCloseTo(b.offsetBins, 12);
  });
  it("rejects zero magnitudes", () => {
    expect(() => parabolicPeak({ below: 0, centre: 1, above: 1 })).toThrow("parabolicPeak requires below, centre and above > 0");
  });
});
