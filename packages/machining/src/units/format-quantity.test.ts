import { describe, expect, it } from "vitest";
import { formatQuantity } from "./format-quantity.js";

describe("formatQuantity", () => {
  it("formats with the unit and grouped digits", () => {
    expect(formatQuantity({ value: 0.0254, quantity: "length", system: "metric" })).toBe("0.0254 mm");
    expect(formatQuantity({ value: 0.0254, quantity: "length", system: "imperial" })).toBe("0.001 in");
    expect(formatQuantity({ value: 18000, quantity: "feedRate", system: "metric" })).toBe("18,000 mm/min");
    expect(formatQuantity({ value: 1828.8, quantity: "feedRate", system: "imperial" })).toBe("72 in/min");
    expect(formatQuantity({ value: 1500, quantity: "power", system: "imperial", significantDigits: 3 })).toBe("2.01 hp");
    expect(formatQuantity({ value: 12345.6, quantity: "volumeRate", system: "metric", locale: "de-DE" })).toBe("12.350 mm³/min");
  });
  it("rejects zero significant digits", () => {
    expect(() => formatQuantity({ value: 1, quantity: "length", system: "metric", significantDigits: 0 })).toThrow("formatQuantity requires significantDigits to be an integer >= 1");
  });
});
