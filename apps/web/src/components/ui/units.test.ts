import { describe, expect, it } from "vitest";
import { formatMeasure, fromDisplay, localiseLimitMessage, measures, parseInputText, toDisplay, toInputText, unitOf } from "./units";

describe("display units", () => {
  it("names the unit of each measure in each system", () => {
    expect(unitOf(measures.length, "metric")).toBe("mm");
    expect(unitOf(measures.length, "imperial")).toBe("in");
    expect(unitOf(measures.chipLoad, "imperial")).toBe("in/tooth");
    expect(unitOf(measures.acceleration, "metric")).toBe("mm/s²");
    expect(unitOf(measures.cuttingSpeed, "imperial")).toBe("sfm");
    expect(unitOf(measures.rpm, "imperial")).toBe("rpm");
  });

  it("converts with published factors", () => {
    // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
    expect(toDisplay(25.4, measures.length, "imperial")).toBeCloseTo(1, 12);
    expect(fromDisplay(0.5, measures.length, "imperial")).toBeCloseTo(12.7, 12);
    // 1 ft/min = 0.3048 m/min exactly, so 100 m/min = 328.08 sfm (NIST SP 811, appendix B, from memory).
    expect(toDisplay(100, measures.cuttingSpeed, "imperial")).toBeCloseTo(328.084, 3);
    // 1 hp (550 ft·lbf/s) = 745.7 W (NIST SP 811, appendix B, from memory).
    expect(toDisplay(745.69987, measures.power, "imperial")).toBeCloseTo(1, 6);
    // 1 lbf/in = 4.4482216 N / 25.4 mm = 0.175127 N/mm (hand calculation from the two exact factors).
    expect(fromDisplay(1, measures.stiffness, "imperial")).toBeCloseTo(0.175127, 6);
    // 1 lb = 0.45359237 kg exactly.
    expect(fromDisplay(1, measures.mass, "imperial")).toBe(0.45359237);
    // Metric is the stored unit: unchanged.
    expect(toDisplay(0.025, measures.length, "metric")).toBe(0.025);
  });

  it("formats with the unit after the number", () => {
    expect(formatMeasure(6.35, measures.length, "imperial")).toBe("0.25\u202Fin");
    expect(formatMeasure(18000, measures.rpm, "metric")).toBe("18\u2009000\u202Frpm");
    expect(formatMeasure(null, measures.length, "metric")).toBe("—");
  });

  it("round-trips what is shown in an input", () => {
    expect(toInputText(6.35, measures.length, "imperial")).toBe("0.25");
    expect(toInputText(6, measures.length, "imperial")).toBe("0.23622");
    expect(parseInputText("0.25", measures.length, "imperial")).toBeCloseTo(6.35, 12);
    expect(parseInputText(" 1 000 ", measures.rpm, "metric")).toBe(1000);
    expect(parseInputText("", measures.length, "metric")).toBeNull();
    expect(parseInputText("1/4", measures.length, "imperial")).toBeNaN();
  });

  it("restates a schema limit in the display unit", () => {
    expect(localiseLimitMessage("stick-out must be at most 400", measures.length, "metric")).toBe("stick-out must be at most 400\u202Fmm");
    expect(localiseLimitMessage("runout must be at most 1", measures.length, "imperial")).toBe("runout must be at most 0.03937\u202Fin");
    expect(localiseLimitMessage("Enter a diameter", measures.length, "imperial")).toBe("Enter a diameter");
  });
});
