import { describe, expect, it } from "vitest";
import { runoutIsLarge } from "./runout";

// Thresholds are common practice, no published source (see runout.ts).
describe("runout warning", () => {
  it("flags runout over 0.02 mm on ordinary cutters", () => {
    expect(runoutIsLarge(0.02, 6)).toBe(false);
    expect(runoutIsLarge(0.021, 6)).toBe(true);
    // 0.003 in = 0.0762 mm: the low end of a poor collet adapter's runout.
    expect(runoutIsLarge(0.003 * 25.4, 12)).toBe(true);
  });

  it("is stricter for cutters of 1/8 in and under", () => {
    expect(runoutIsLarge(0.015, 3.175)).toBe(true);
    expect(runoutIsLarge(0.01, 3.175)).toBe(false);
    expect(runoutIsLarge(0.015, 6)).toBe(false);
  });

  it("says nothing about a value not yet entered", () => {
    expect(runoutIsLarge(Number.NaN, 3)).toBe(false);
  });
});
