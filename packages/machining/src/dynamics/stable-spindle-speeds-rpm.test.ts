import { describe, expect, it } from "vitest";
import { stableSpindleSpeedsRpm } from "./stable-spindle-speeds-rpm.js";

describe("stableSpindleSpeedsRpm", () => {
  it("CHT-1: chatter 1250 Hz, 3 flutes → 25 000 / 12 500 / 8333.33 rpm (domain-reference CHT-1; Smith & Tlusty)", () => {
    const s = stableSpindleSpeedsRpm({ chatterFrequencyHz: 1250, flutes: 3, count: 3 });
    expect(s[0]).toBeCloseTo(25000, 6);
    expect(s[1]).toBeCloseTo(12500, 6);
    expect(s[2]).toBeCloseTo(8333.33, 2);
  });
  it("CHT-2: 730.2 Hz, 2 flutes → 21 906 / 10 953 rpm (domain-reference CHT-2)", () => {
    const s = stableSpindleSpeedsRpm({ chatterFrequencyHz: 730.2, flutes: 2, count: 2 });
    expect(s[0]).toBeCloseTo(21906, 6);
    expect(s[1]).toBeCloseTo(10953, 6);
  });
  it("TPF-5: mode 580 Hz, 2 flutes → 17 400 / 8700 / 5800 rpm, highest first (domain-reference TPF-5)", () => {
    expect(stableSpindleSpeedsRpm({ chatterFrequencyHz: 580, flutes: 2, count: 3 }).map((v) => Math.round(v * 1e6) / 1e6)).toEqual([17400, 8700, 5800]);
  });
  it("rejects a zero count", () => {
    expect(() => stableSpindleSpeedsRpm({ chatterFrequencyHz: 500, flutes: 2, count: 0 })).toThrow("stableSpindleSpeedsRpm requires count to be an integer >= 1");
  });
});
