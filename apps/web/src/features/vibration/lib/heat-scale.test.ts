import { describe, expect, it } from "vitest";
import { HEAT_SOFT, HEAT_STIFF, heatColour, heatScale, hexToOklab, niceTicks, oklabToHex } from "./heat-scale";

describe("OKLab conversion", () => {
  it("matches published values for white, black and sRGB red", () => {
    // White is L = 1, a = b = 0 and black L = 0 by construction of OKLab (Ottosson 2020).
    const white = hexToOklab("#FFFFFF");
    expect(white[0]).toBeCloseTo(1, 4);
    expect(white[1]).toBeCloseTo(0, 4);
    expect(white[2]).toBeCloseTo(0, 4);
    expect(hexToOklab("#000000")[0]).toBeCloseTo(0, 6);
    // sRGB red = oklch(62.8 % 0.2577 29.23°) in CSS Color Module Level 4's examples
    // (from memory), i.e. a = 0.2577·cos 29.23° = 0.2249, b = 0.2577·sin 29.23° = 0.1258.
    const red = hexToOklab("#FF0000");
    expect(red[0]).toBeCloseTo(0.628, 3);
    expect(red[1]).toBeCloseTo(0.2249, 3);
    expect(red[2]).toBeCloseTo(0.1258, 3);
  });

  it("round-trips sRGB colours", () => {
    for (const hex of ["#F6F4EE", "#1F6F8B", "#B83A2E", "#22252A", "#808080"]) expect(oklabToHex(hexToOklab(hex))).toBe(hex);
  });
});

describe("heatColour", () => {
  it("runs from the soft colour to the stiff colour and clips outside 0…1", () => {
    expect(heatColour(0)).toBe(HEAT_SOFT);
    expect(heatColour(1)).toBe(HEAT_STIFF);
    expect(heatColour(-2)).toBe(HEAT_SOFT);
    expect(heatColour(7)).toBe(HEAT_STIFF);
    expect(heatColour(Number.NaN)).toBe(HEAT_SOFT);
  });

  it("gets darker step by step: perceived lightness falls monotonically from soft to stiff", () => {
    let previous = Number.POSITIVE_INFINITY;
    for (let i = 0; i <= 20; i++) {
      const [L] = hexToOklab(heatColour(i / 20));
      expect(L).toBeLessThan(previous + 1e-3);
      previous = L;
    }
    expect(hexToOklab(HEAT_SOFT)[0] - hexToOklab(HEAT_STIFF)[0]).toBeGreaterThan(0.35);
  });
});

describe("heatScale", () => {
  it("places values linearly between the map's minimum and maximum", () => {
    const scale = heatScale(800, 1800);
    expect(scale.position(800)).toBe(0);
    expect(scale.position(1300)).toBe(0.5);
    expect(scale.position(1800)).toBe(1);
    expect(scale.position(5000)).toBe(1);
    expect(scale.colour(800)).toBe(HEAT_SOFT);
    expect(scale.colour(1800)).toBe(HEAT_STIFF);
    // Step worked by hand: (1800 − 800)/4 = 250, a nice step already; first tick ⌈800/250⌉·250 = 1000.
    expect(scale.ticks).toEqual([1000, 1250, 1500, 1750]);
  });

  it("puts a single value (one reading) in the middle of the scale", () => {
    const scale = heatScale(1200, 1200);
    expect(scale.position(1200)).toBe(0.5);
    expect(scale.colour(1200)).toBe(heatColour(0.5));
    expect(scale.ticks).toEqual([1200]);
  });

  it("refuses a range that is not finite", () => {
    expect(() => heatScale(Number.NaN, 3)).toThrow("heatScale requires finite min and max");
  });
});

describe("niceTicks", () => {
  it("steps by 1, 2, 2.5 or 5 × 10ⁿ and stays inside the range", () => {
    expect(niceTicks(0, 10, 6)).toEqual([0, 2, 4, 6, 8, 10]);
    // (1987 − 1234)/4 = 188.25 → next nice step 200; ⌈1234/200⌉·200 = 1400.
    expect(niceTicks(1234, 1987, 5)).toEqual([1400, 1600, 1800]);
    // (0.031 − 0.013)/3 = 0.006 → next nice step 0.01 (5·10⁻³ is too small); no float noise in the values.
    expect(niceTicks(0.013, 0.031, 4)).toEqual([0.02, 0.03]);
    expect(niceTicks(0.013, 0.031, 8)).toEqual([0.015, 0.02, 0.025, 0.03]);
    expect(niceTicks(5, 1, 3)).toEqual([2, 4]);
  });
});
