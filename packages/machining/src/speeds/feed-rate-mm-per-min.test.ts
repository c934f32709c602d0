import fc from "fast-check";
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { feedRateMmPerMin } from "./feed-rate-mm-per-min.js";

describe("feedRateMmPerMin", () => {
  it("FEED-1: 0.05 mm × 2 flutes × 18 000 rpm = 1800 mm/min (domain-reference FEED-1; MH / SME, FOUND)", () => {
    expect(feedRateMmPerMin({ rpm: 18000, flutes: 2, chipLoadMm: 0.05 })).toBeCloseTo(1800, 9);
  });

  it("FEED-2: 0.002 in × 2 × 18 000 rpm = 72 in/min (domain-reference FEED-2; SME, FOUND)", () => {
    const fz = unit(0.002, "inch").toNumber("mm");
    const vf = feedRateMmPerMin({ rpm: 18000, flutes: 2, chipLoadMm: fz });
    expect(unit(vf, "mm/minute").toNumber("inch/minute")).toBeCloseTo(72, 9);
  });

  it("FEED-3: 120 in/min at 2 flutes and 10 000 rpm is a 0.006 in chip (domain-reference FEED-3, COMPUTED)", () => {
    const fz = unit(0.006, "inch").toNumber("mm");
    expect(unit(feedRateMmPerMin({ rpm: 10000, flutes: 2, chipLoadMm: fz }), "mm/minute").toNumber("inch/minute")).toBeCloseTo(120, 9);
    expect(fz).toBeCloseTo(0.1524, 9);
  });

  it("feed rises with chip load (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 60000, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        fc.double({ min: 1.000001, max: 10, noNaN: true }),
        (rpm, flutes, fz, k) => {
          const a = feedRateMmPerMin({ rpm, flutes, chipLoadMm: fz });
          const b = feedRateMmPerMin({ rpm, flutes, chipLoadMm: fz * k });
          expect(b).toBeGreaterThan(a);
        },
      ),
    );
  });

  it("rejects a fractional flute count", () => {
    expect(() => feedRateMmPerMin({ rpm: 1000, flutes: 2.5, chipLoadMm: 0.1 })).toThrow("feedRateMmPerMin requires flutes to be an integer >= 1");
  });
});
