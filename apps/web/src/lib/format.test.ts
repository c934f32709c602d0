import { describe, expect, it } from "vitest";
import { formatNumber, formatQuantity, MINUS, NUMBER_UNIT_SPACE, THIN_SPACE } from "./format";

// Expected strings follow the SI Brochure, 9th edition (BIPM 2019), §5.4.4:
// digits may be grouped in threes separated by a (thin) space, never a comma or
// point, and a space separates the number from the unit symbol.

describe("formatNumber", () => {
  it("groups thousands with a thin space in metric display", () => {
    expect(formatNumber(18000)).toBe(`18${THIN_SPACE}000`);
    expect(formatNumber(1234567)).toBe(`1${THIN_SPACE}234${THIN_SPACE}567`);
    expect(formatNumber(999)).toBe("999");
  });

  it("groups thousands with a comma in imperial display", () => {
    expect(formatNumber(18000, { system: "imperial" })).toBe("18,000");
  });

  it("never groups the decimals", () => {
    expect(formatNumber(12345.6789, { fractionDigits: 4 })).toBe(`12${THIN_SPACE}345.6789`);
  });

  it("rounds half away from zero to the requested decimals", () => {
    expect(formatNumber(0.125, { fractionDigits: 2 })).toBe("0.13");
    expect(formatNumber(2.5)).toBe("3");
    expect(formatNumber(0.05, { fractionDigits: 3 })).toBe("0.050");
  });

  it("rounds to significant digits when asked", () => {
    expect(formatNumber(0.0123456, { significantDigits: 3 })).toBe("0.0123");
    expect(formatNumber(123456, { significantDigits: 2 })).toBe(`120${THIN_SPACE}000`);
  });

  it("uses a true minus sign and drops a rounded-away sign", () => {
    expect(formatNumber(-1500)).toBe(`${MINUS}1${THIN_SPACE}500`);
    expect(formatNumber(-0.0004, { fractionDigits: 2 })).toBe("0.00");
  });

  it("shows a dash for a missing or non-finite value", () => {
    expect(formatNumber(null)).toBe("—");
    expect(formatNumber(undefined)).toBe("—");
    expect(formatNumber(Number.NaN)).toBe("—");
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe("—");
  });

  it("rejects impossible precision instead of guessing", () => {
    expect(() => formatNumber(1, { fractionDigits: -1 })).toThrow(RangeError);
    expect(() => formatNumber(1, { significantDigits: 0 })).toThrow(RangeError);
  });
});

describe("formatQuantity", () => {
  it("joins number and unit with a narrow no-break space", () => {
    expect(formatQuantity(18000, "rpm")).toBe(`18${THIN_SPACE}000${NUMBER_UNIT_SPACE}rpm`);
    expect(formatQuantity(0.05, "mm/tooth", { fractionDigits: 2 })).toBe(`0.05${NUMBER_UNIT_SPACE}mm/tooth`);
  });

  it("leaves counts without a unit", () => {
    expect(formatQuantity(3, "")).toBe("3");
  });
});
